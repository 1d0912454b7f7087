// One jest run, five projects: the pure engine and API types (shared), the Express API against a
// real PostgreSQL (server), faults, loads and hostile input against the real app (reliability),
// the Angular components under jsdom (client), and real-browser end-to-end tests (e2e). The
// projects that need a database share one throwaway PostgreSQL cluster, started by their global
// set-up (reference-counted, so it starts once per jest run).
const fs = require('node:fs');
const path = require('node:path');

/** Jest refuses a root that does not exist; a folder without tracked files is not in a clone. */
const existing = (...folders) => folders.filter((folder) => fs.existsSync(path.join(__dirname, folder))).map((folder) => `<rootDir>/${folder}`);

/** The path aliases of tsconfig.json (`@shared/...` is shared/...), for jest's own module resolution. */
const moduleNameMapper = Object.fromEntries(
  ['shared', 'server', 'fixtures', 'seeders', 'tests', 'local-stack', 'bench'].map((folder) => [`^@${folder}/(.*)$`, `<rootDir>/${folder}/$1`]),
);

const nodeTransform = {
  '^.+\\.ts$': ['ts-jest', { tsconfig: { module: 'commonjs', moduleResolution: 'node', isolatedModules: true } }],
};

module.exports = {
  // Server files start their own app on a copy of the database: on a loaded two-core machine that
  // alone can pass jest's default 5 s, in a hook as in a test. (Jest 30 reads this only here, not
  // in a project.)
  testTimeout: 60_000,
  // Two test files at a time on this two-core machine (jest's default would be one): most files
  // wait on PostgreSQL, HTTP or a browser much of the time, and the whole run takes two thirds as long.
  maxWorkers: 2,
  projects: [
    {
      displayName: 'shared',
      moduleNameMapper,
      testEnvironment: 'node',
      roots: existing('shared', 'fixtures', 'tests/cli', 'tests/soundness'),
      testMatch: ['**/*.spec.ts'],
      setupFiles: ['<rootDir>/tests/support/property-seed.ts'],
      transform: nodeTransform,
    },
    {
      displayName: 'server',
      moduleNameMapper,
      testEnvironment: 'node',
      roots: existing('server', 'local-stack', 'tests/api'),
      testMatch: ['**/*.spec.ts'],
      transform: nodeTransform,
      globalSetup: '<rootDir>/tests/support/database-setup-hook.cjs',
      globalTeardown: '<rootDir>/tests/support/database-teardown-hook.cjs',
    },
    {
      // Faults, loads and hostile input against the real app (`npm run test:reliability`).
      displayName: 'reliability',
      moduleNameMapper,
      testEnvironment: 'node',
      roots: existing('tests/reliability'),
      testMatch: ['**/*.spec.ts'],
      transform: nodeTransform,
      globalSetup: '<rootDir>/tests/support/database-setup-hook.cjs',
      globalTeardown: '<rootDir>/tests/support/database-teardown-hook.cjs',
    },
    {
      displayName: 'client',
      moduleNameMapper,
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
      moduleNameMapper,
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.spec.ts'],
      transform: nodeTransform,
      globalSetup: '<rootDir>/tests/support/browser-setup-hook.cjs',
      globalTeardown: '<rootDir>/tests/support/database-teardown-hook.cjs',
    },
  ],
};
