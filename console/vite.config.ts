import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

// The dev server forwards API, docs and spec requests to the local NestJS server, so the console
// talks to the same origin in development and in production (where the server serves dist/).
const apiTarget = `http://127.0.0.1:${process.env.PORT || '3000'}`;

export default defineConfig({
  base: '/',
  plugins: [react(), tailwindcss()],
  resolve: {
    // The lighting math is compiled from source, so the console never waits on (or ships a stale)
    // shared/dist; it is pure TypeScript with no I/O, so bundling its source is safe.
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@lumenwright/shared': fileURLToPath(new URL('../shared/src/index.ts', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    proxy: {
      '/v1': { target: apiTarget, changeOrigin: false },
      '/docs': { target: apiTarget, changeOrigin: false },
      '/openapi.json': { target: apiTarget, changeOrigin: false },
    },
  },
  preview: { host: '127.0.0.1' },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: false,
    // Stay at or under the 200 kB gzip budget for the first load; routes are split with React.lazy.
    chunkSizeWarningLimit: 600,
  },
});
