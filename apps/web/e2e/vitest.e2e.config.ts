import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser tests: node drives a real Chromium against a running Skyhours at SKYHOURS_URL.
export default defineConfig({
  root: fileURLToPath(new URL('..', import.meta.url)),
  test: {
    environment: 'node',
    include: ['e2e/**/*.e2e.test.ts'],
    // One browser at a time: files share the server and its demo data.
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
