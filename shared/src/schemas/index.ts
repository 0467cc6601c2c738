export * from './health';
export * from './roles';
export * from './jobs';
export * from './runs';
