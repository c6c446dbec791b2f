// `npm run mutation`: Stryker changes the code that decides and proves a record, one mutant at a time, and the
// unit tests must notice. Not part of `npm test` (it takes minutes of CPU); no database is needed.
/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
export default {
  testRunner: 'vitest',
  vitest: { configFile: 'tests/mutation/vitest.config.ts' },
  mutate: [
    'shared/domain/**/*.ts',
    '!shared/domain/**/*.test.ts',
    'server/audit/trail-chain.ts',
    'server/audit/record-check.ts',
    'server/security/lockout.ts',
    'server/security/hashing.ts',
    'server/security/signing.ts',
  ],
  coverageAnalysis: 'perTest',
  // Two cores shared with other work: one mutant at a time.
  concurrency: 1,
  timeoutMS: 20_000,
  reporters: ['clear-text', 'json', 'progress'],
  jsonReporter: { fileName: 'tests/mutation/report/mutation.json' },
  clearTextReporter: { allowColor: false, logTests: false, reportMutants: true },
  ignorePatterns: ['dist', '.data', '.tmp', 'tests/mutation/report', 'test-results', 'screenshots'],
  tempDirName: '.tmp/stryker',
  cleanTempDir: true,
  thresholds: { high: 90, low: 85, break: 85 },
};
