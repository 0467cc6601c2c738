import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { render } from '../../../test-utils/render';
import { DeleteDatasetButton } from './DeleteDatasetButton';

describe('DeleteDatasetButton', () => {
  it('deletes only after the confirmation, and keeping it deletes nothing', async () => {
    const onConfirm = vi.fn();
    render(<DeleteDatasetButton name="Quarry A" versionCount={2} pending={false} error={null} onConfirm={onConfirm} />);
    await userEvent.click(screen.getByRole('button', { name: 'Delete dataset' }));
    expect(onConfirm).not.toHaveBeenCalled();
    expect(await screen.findByText(/deletes all 2 versions/)).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Keep it' }));
    expect(onConfirm).not.toHaveBeenCalled();
    await userEvent.click(screen.getByRole('button', { name: 'Delete dataset' }));
    await userEvent.click(await screen.findByRole('button', { name: 'Delete for good' }));
    expect(onConfirm).toHaveBeenCalledTimes(1);
  });

  it('shows why a deletion was refused inside the dialog', async () => {
    const error = new Error('This data is used by a signed-off study and cannot be deleted');
    render(<DeleteDatasetButton name="Quarry A" versionCount={1} pending={false} error={error} onConfirm={vi.fn()} />);
    await userEvent.click(screen.getByRole('button', { name: 'Delete dataset' }));
    expect(await screen.findByText(/signed-off study/)).toBeInTheDocument();
  });
});
