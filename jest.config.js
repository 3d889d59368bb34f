/**
 * One Jest for the whole repo, a project per suite. `node scripts/test.mjs` runs them all and
 * prints the closing "N passed, N failed" line that CI reads.
 */
const swc = ['@swc/jest', { jsc: { parser: { syntax: 'typescript', tsx: true }, target: 'es2022' }, module: { type: 'commonjs' } }];
const alias = { '^@/(.*)$': '<rootDir>/$1' };
const ignore = ['/node_modules/', '/dist/', '/.pg/'];

module.exports = {
  // Server and browser tests boot a seeded database per file; on two busy cores that can take
  // longer than Jest's 5 s default. A hung test still fails, just later.
  testTimeout: 30_000,
  projects: [
    {
      displayName: 'shared',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/shared'],
      transform: { '^.+\\.tsx?$': swc },
      moduleNameMapper: alias,
      testPathIgnorePatterns: ignore,
    },
    {
      displayName: 'server',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/server'],
      transform: { '^.+\\.tsx?$': swc },
      moduleNameMapper: alias,
      testPathIgnorePatterns: ignore,
    },
    {
      displayName: 'components',
      preset: 'jest-expo',
      roots: ['<rootDir>/tests/components'],
      moduleNameMapper: alias,
      testPathIgnorePatterns: [...ignore, '\\.web\\.test\\.tsx$', '\\.test\\.web\\.tsx$'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      transform: { '^.+\\.tsx?$': swc },
      moduleNameMapper: alias,
      testPathIgnorePatterns: ignore,
    },
  ],
};
