/** Jest for the workers: ts-jest on the TypeScript sources; the shared engine is read from source. */
module.exports = {
  rootDir: 'src',
  testEnvironment: 'node',
  testMatch: ['**/*.spec.ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/../tsconfig.spec.json' }],
    // ESM-only packages (d3-array and friends) are turned into CommonJS for Jest.
    '^.+\\.js$': ['ts-jest', { tsconfig: '<rootDir>/../tsconfig.spec.json' }],
  },
  transformIgnorePatterns: ['/node_modules/(?!(d3-array|internmap|archiver|zip-stream|compress-commons|crc32-stream|is-stream)/)'],
  moduleNameMapper: {
    '^@provenote/shared$': '<rootDir>/../../shared/src/index.ts',
  },
};
