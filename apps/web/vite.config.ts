import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig, type ProxyOptions } from 'vite';

const fromHere = (path: string) => fileURLToPath(new URL(path, import.meta.url));

// The API runs beside the dev server; the browser only ever talks to one origin, so the session
// cookie and CSRF token work the same in development as behind the real server.
const apiProxy: Record<string, ProxyOptions> = {
  '/api': { target: `http://127.0.0.1:${process.env.API_PORT ?? 3000}` },
};

export default defineConfig({
  // Explicit, so builds and tests behave the same when run from the repository root.
  root: fromHere('.'),
  plugins: [react()],
  resolve: {
    alias: {
      '@/': fromHere('./src/'),
      // Consume the calculator as source: no prior build of the library is needed.
      '@skyhours/calc': fromHere('../../libs/calc/src/index.ts'),
    },
  },
  server: { proxy: apiProxy },
  preview: { proxy: apiProxy },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: true,
    rolldownOptions: {
      output: {
        // The frame's libraries change less often than the app: separate chunks stay cached
        // across releases. Feature-only libraries (charts, tables) stay in their lazy chunks.
        codeSplitting: {
          groups: [
            {
              name: 'react',
              test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom)[\\/]/,
            },
            {
              name: 'chakra',
              test: /node_modules[\\/](@chakra-ui|@ark-ui|@zag-js|@emotion|@floating-ui|@internationalized|@pandacss|@swc)[\\/]/,
            },
            { name: 'query', test: /node_modules[\\/]@tanstack[\\/](react-query|query-core)[\\/]/ },
          ],
        },
      },
    },
  },
});
