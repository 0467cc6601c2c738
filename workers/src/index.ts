export * from './queue/run-store';
export * from './queue/run-events';
export * from './queue/run-queue';
export * from './queue/job-context';
export * from './queue/run-worker';
export * from './processors/classify.processor';
export * from './processors/group-check.processor';
export * from './processors/run-processors';
