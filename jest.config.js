// One jest run, four projects: the pure engine and API types (shared), the Express API against a
// real PostgreSQL (server), the Angular components under jsdom (client), and one real-browser
// end-to-end test (e2e). The global set-up starts one throwaway PostgreSQL cluster for all of them.
const nodeTransform = {
  '^.+\\.ts$': ['ts-jest', { tsconfig: { module: 'commonjs', moduleResolution: 'node', isolatedModules: true }, isolatedModules: true }],
};

module.exports = {
  globalSetup: '<rootDir>/tests/support/global-setup.ts',
  globalTeardown: '<rootDir>/tests/support/global-teardown.ts',
  projects: [
    {
      displayName: 'shared',
      testEnvironment: 'node',
      roots: ['<rootDir>/shared', '<rootDir>/fixtures'],
      testMatch: ['**/*.spec.ts'],
      transform: nodeTransform,
    },
    {
      displayName: 'server',
      testEnvironment: 'node',
      roots: ['<rootDir>/server', '<rootDir>/tests/api'],
      testMatch: ['**/*.spec.ts'],
      transform: nodeTransform,
    },
    {
      displayName: 'client',
      preset: 'jest-preset-angular',
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
      roots: ['<rootDir>/src'],
      testMatch: ['**/*.spec.ts'],
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': ['jest-preset-angular', { tsconfig: '<rootDir>/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' }],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.spec.ts'],
      transform: nodeTransform,
    },
  ],
};
