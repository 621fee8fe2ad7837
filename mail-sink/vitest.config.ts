import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    // Also when run from the repository root with --config.
    root: fileURLToPath(new URL('.', import.meta.url)),
    include: ['test/**/*.test.ts'],
    // Each test starts real SMTP and HTTP servers on free ports.
    testTimeout: 15_000,
  },
});
