export * from './health';
export * from './roles';
