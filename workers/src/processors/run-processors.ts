import type { RunKind } from '@provenote/shared';
import type { RunProcessor } from '../queue/run-worker';
import { classifyProcessor } from './classify.processor';
import { groupCheckProcessor } from './group-check.processor';

/** The processors of every run kind that can be computed today; robust-fit and bundle have none yet. */
export const runProcessors: Partial<Record<RunKind, RunProcessor>> = {
  classify: classifyProcessor,
  'group-check': groupCheckProcessor,
};
