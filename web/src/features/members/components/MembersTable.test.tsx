import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Member } from '@provenote/shared/schemas';
import { describe, expect, it, vi } from 'vitest';
import { render } from '../../../test-utils/render';
import { MembersTable } from './MembersTable';

const members: Member[] = [
  {
    membershipId: '0b6f1d6e-4c1f-4a63-9d55-5f0d1a2b3c4d',
    userId: '1c7e2f8a-5b3d-4e2f-8a1b-6c7d8e9f0a1b',
    email: 'pi@lab.test',
    displayName: 'Rosa Pi',
    role: 'pi',
    joinedAt: '2025-01-10T09:00:00.000Z',
  },
  {
    membershipId: '2d8f3a9b-6c4e-4f3a-9b2c-7d8e9f0a1b2c',
    userId: '3e9a4b0c-7d5f-4a4b-8c3d-8e9f0a1b2c3d',
    email: 'student@lab.test',
    displayName: 'Sam Student',
    role: 'student',
    joinedAt: '2025-02-11T09:00:00.000Z',
  },
];

const props = { members, currentUserId: members[0].userId, onChangeRole: vi.fn(), onRemove: vi.fn() };

describe('MembersTable', () => {
  it('lets a PI change a role and remove a member', async () => {
    const onChangeRole = vi.fn();
    const onRemove = vi.fn();
    render(<MembersTable {...props} canManage onChangeRole={onChangeRole} onRemove={onRemove} />);
    await userEvent.selectOptions(screen.getByRole('combobox', { name: 'Role of Sam Student' }), 'Analyst');
    expect(onChangeRole).toHaveBeenCalledWith(members[1], 'analyst');
    await userEvent.click(screen.getByRole('button', { name: 'Remove Sam Student' }));
    expect(onRemove).toHaveBeenCalledWith(members[1]);
  });

  it('marks the signed-in person and offers them to leave rather than remove', () => {
    render(<MembersTable {...props} canManage />);
    const row = screen.getByText('Rosa Pi').closest('tr') as HTMLElement;
    expect(within(row).getByText('(you)')).toBeInTheDocument();
    expect(within(row).getByRole('button', { name: 'Remove Rosa Pi' })).toHaveTextContent('Leave');
  });

  it('is read-only for members who are not PI', () => {
    render(<MembersTable {...props} canManage={false} />);
    expect(screen.queryByRole('combobox', { name: /Role of/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    const row = screen.getByText('Sam Student').closest('tr') as HTMLElement;
    expect(within(row).getByText('Student')).toBeInTheDocument();
  });
});
