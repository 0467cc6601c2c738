import { describe, expect, it } from 'vitest';
import {
  applyRunOutcome,
  applyStepEdit,
  newlyStaleSteps,
  stepBlocker,
  stepKeys,
  type StepState,
  type StepStatus,
} from './notebook';

const RUN = '00000000-0000-4000-8000-000000000001';

/** A notebook with the given statuses, top to bottom; computed cards that ran carry a run id. */
function notebook(statuses: StepStatus[]): StepState[] {
  return stepKeys.map((key, i) => ({
    key,
    status: statuses[i],
    runId: ['check', 'assign', 'export'].includes(key) && statuses[i] !== 'not_run' ? RUN : null,
  }));
}

const statuses = (steps: StepState[]) => steps.map((s) => s.status);

describe('applyStepEdit (the stale rule)', () => {
  const allCurrent = notebook(['current', 'current', 'current', 'current', 'current', 'current', 'current']);

  it('marks every card below the edited one stale and leaves the cards above alone', () => {
    expect(statuses(applyStepEdit(allCurrent, 'prepare'))).toEqual([
      'current',
      'current',
      'stale',
      'stale',
      'stale',
      'stale',
      'stale',
    ]);
  });

  it('keeps a settings-only card current after its own edit', () => {
    expect(applyStepEdit(allCurrent, 'groups')[2].status).toBe('current');
  });

  it('makes an edited card with results stale, so it is run again', () => {
    expect(applyStepEdit(allCurrent, 'assign')[4].status).toBe('stale');
    expect(statuses(applyStepEdit(allCurrent, 'assign')).slice(0, 4)).toEqual([
      'current',
      'current',
      'current',
      'current',
    ]);
  });

  it('leaves a never-run computed card as not run when it is edited', () => {
    const fresh = notebook(['current', 'current', 'current', 'not_run', 'not_run', 'not_run', 'not_run']);
    expect(applyStepEdit(fresh, 'check')[3].status).toBe('not_run');
  });

  it('leaves cards below that were never run as not run', () => {
    const partly = notebook(['current', 'current', 'current', 'current', 'not_run', 'not_run', 'not_run']);
    expect(statuses(applyStepEdit(partly, 'data'))).toEqual([
      'current',
      'stale',
      'stale',
      'stale',
      'not_run',
      'not_run',
      'not_run',
    ]);
  });

  it('turns running and failed cards below stale: their inputs changed', () => {
    const busy = notebook(['current', 'current', 'current', 'failed', 'running', 'not_run', 'not_run']);
    expect(statuses(applyStepEdit(busy, 'prepare')).slice(3, 5)).toEqual(['stale', 'stale']);
  });

  it('does not change the steps it is given', () => {
    const copy = structuredClone(allCurrent);
    applyStepEdit(allCurrent, 'data');
    expect(allCurrent).toEqual(copy);
  });

  it('refuses a notebook with missing or reordered cards', () => {
    expect(() => applyStepEdit(allCurrent.slice(1), 'prepare')).toThrow(/exactly the steps/);
    expect(() => applyStepEdit([...allCurrent].reverse(), 'prepare')).toThrow(/exactly the steps/);
  });
});

describe('newlyStaleSteps', () => {
  it('names only the cards the edit turned stale', () => {
    const before = notebook(['current', 'current', 'current', 'stale', 'current', 'not_run', 'not_run']);
    expect(newlyStaleSteps(before, applyStepEdit(before, 'groups'))).toEqual(['assign']);
  });
});

describe('stepBlocker', () => {
  it('allows a card whose cards above are all current', () => {
    const steps = notebook(['current', 'current', 'current', 'not_run', 'not_run', 'not_run', 'not_run']);
    expect(stepBlocker(steps, 'check')).toBeNull();
    expect(stepBlocker(steps, 'data')).toBeNull();
  });

  it('asks to confirm a stale settings card, and to run a stale computed one', () => {
    expect(
      stepBlocker(notebook(['current', 'current', 'stale', 'stale', 'not_run', 'not_run', 'not_run']), 'check'),
    ).toBe('"Reference groups" is stale; check its settings and save them again first.');
  });

  it('names the first card above that is not current, and why', () => {
    expect(
      stepBlocker(notebook(['current', 'not_run', 'not_run', 'not_run', 'not_run', 'not_run', 'not_run']), 'assign'),
    ).toBe('Complete "Prepare" first.');
    expect(
      stepBlocker(notebook(['current', 'current', 'current', 'stale', 'stale', 'not_run', 'not_run']), 'assign'),
    ).toBe('"Group check" is stale; run it again first.');
    expect(
      stepBlocker(notebook(['current', 'current', 'current', 'running', 'not_run', 'not_run', 'not_run']), 'assign'),
    ).toBe('Wait for "Group check" to finish.');
    expect(
      stepBlocker(notebook(['current', 'current', 'current', 'failed', 'not_run', 'not_run', 'not_run']), 'assign'),
    ).toBe('"Group check" failed; fix it and run it again first.');
  });
});

describe('applyRunOutcome', () => {
  const running: StepState = { key: 'assign', status: 'running', runId: RUN };

  it('makes the card current when its run succeeds and failed when it fails', () => {
    expect(applyRunOutcome(running, RUN, 'succeeded').status).toBe('current');
    expect(applyRunOutcome(running, RUN, 'failed').status).toBe('failed');
    expect(applyRunOutcome(running, RUN, 'cancelled').status).toBe('stale');
  });

  it('ignores a run the card no longer waits for', () => {
    const other = '00000000-0000-4000-8000-000000000002';
    expect(applyRunOutcome(running, other, 'succeeded')).toBe(running);
    const edited: StepState = { ...running, status: 'stale' };
    expect(applyRunOutcome(edited, RUN, 'succeeded')).toBe(edited);
  });
});
