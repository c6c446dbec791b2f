import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import { aliases } from '../../vite.config';

// The unit tests of the mutated modules only: pure code, no database, no browser.
export default defineConfig({
  resolve: { alias: aliases },
  root: fileURLToPath(new URL('../..', import.meta.url)),
  test: { include: ['shared/**/*.test.ts', 'server/**/*.test.ts'] },
});
