/**
 * Jest for the api: unit specs beside the code, integration specs on a real PostgreSQL and Redis.
 * The global setup starts a throwaway cluster unless DATABASE_URL is already set (as `npm test` does).
 */
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }];
module.exports = {
  rootDir: '.',
  roots: ['<rootDir>/src', '<rootDir>/test'],
  testEnvironment: 'node',
  // TypeScript sources first: a stray compiled .js beside a .ts must never shadow it.
  moduleFileExtensions: ['ts', 'js', 'json', 'node'],
  testMatch: ['**/*.spec.ts'],
  transform: { '^.+\\.ts$': tsJest, '^.+\\.js$': tsJest },
  // ESM-only packages are turned into CommonJS for Jest.
  transformIgnorePatterns: [
    '/node_modules/(?!(d3-array|internmap|archiver|zip-stream|compress-commons|crc32-stream|is-stream)/)',
  ],
  moduleNameMapper: {
    '^@provenote/shared$': '<rootDir>/../shared/src/index.ts',
    '^@provenote/workers$': '<rootDir>/../workers/src/index.ts',
    // The shared workspace's sources import each other with ".js" (nodenext); Jest reads the .ts beside them.
    '^(\\.{1,2}/.*)\\.js$': '$1',
  },
  globalSetup: '<rootDir>/test/global-setup.cjs',
  globalTeardown: '<rootDir>/test/global-teardown.cjs',
  testTimeout: 30000,
};
