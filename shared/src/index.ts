export const ENGINE_VERSION = '0.1.0';
export * from './engine/index';
export * from './schemas/index';
