import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // Each test starts real SMTP and HTTP servers on free ports.
    testTimeout: 15_000,
  },
});
