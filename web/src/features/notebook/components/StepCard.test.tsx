import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { Step } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { StepCard } from './StepCard';

const step = (overrides: Partial<Step>): Step => ({
  key: 'assign',
  status: 'current',
  parameters: { probability: 'hotelling', alpha: 0.05 },
  runId: null,
  error: null,
  updatedAt: '2025-05-01T10:00:00.000Z',
  updatedBy: 'Ada Analyst',
  ...overrides,
});

describe('StepCard', () => {
  it('shows its number, title and status in words', () => {
    render(<StepCard labId="lab" step={step({})} blocker={null} locked={false} />);
    expect(screen.getByRole('heading', { name: '5. Assign' })).toBeInTheDocument();
    expect(screen.getByText('Current')).toBeInTheDocument();
    expect(screen.getByRole('region', { name: '5. Assign' })).toBeInTheDocument();
  });

  it('offers to run a stale computed card again', async () => {
    const onRerun = vi.fn();
    render(<StepCard labId="lab" step={step({ status: 'stale' })} blocker={null} locked={false} onRerun={onRerun} />);
    expect(screen.getByText('Stale')).toBeInTheDocument();
    expect(screen.getByText(/no longer follow from the cards above/)).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Run again' }));
    expect(onRerun).toHaveBeenCalledOnce();
  });

  it('asks to confirm the settings of a stale settings card', () => {
    render(
      <StepCard
        labId="lab"
        step={step({ key: 'groups', status: 'stale' })}
        blocker={null}
        locked={false}
        onRerun={() => undefined}
      />,
    );
    expect(screen.getByRole('button', { name: 'Keep these settings' })).toBeInTheDocument();
  });

  it('names the card above that blocks it instead of offering a re-run', () => {
    render(
      <StepCard
        labId="lab"
        step={step({ status: 'stale' })}
        blocker={'"Group check" is stale; run it again first.'}
        locked={false}
        onRerun={() => undefined}
      />,
    );
    expect(screen.getByText('"Group check" is stale; run it again first.')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Run again' })).not.toBeInTheDocument();
  });

  it('offers nothing on a signed-off study', () => {
    render(<StepCard labId="lab" step={step({ status: 'stale' })} blocker={null} locked onRerun={() => undefined} />);
    expect(screen.queryByRole('button', { name: 'Run again' })).not.toBeInTheDocument();
  });

  it('shows why the last run failed', () => {
    render(
      <StepCard
        labId="lab"
        step={step({ status: 'failed', error: 'group "North" has n = 3 ≤ p = 4' })}
        blocker={null}
        locked={false}
      />,
    );
    expect(screen.getByText('group "North" has n = 3 ≤ p = 4')).toBeInTheDocument();
  });
});
