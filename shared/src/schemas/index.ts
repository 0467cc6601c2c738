export * from './health';
export * from './roles';
export * from './jobs';
export * from './runs';
export * from './notebook';
export * from './studies';
export * from './groups';
