import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { resolve } from 'node:path';

const apiPort = process.env.API_PORT ?? '3001';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    sourcemap: true,
    // The server reads the reader entries' built names from the manifest (server/public-site/reader-assets.ts).
    manifest: true,
    rolldownOptions: {
      input: {
        // The staff app.
        main: resolve(import.meta.dirname, 'index.html'),
        // Reader pages: a stylesheet and one small plain-TypeScript script, no React (see the JS budget test).
        reader: resolve(import.meta.dirname, 'src/public/reader.css'),
        'chart-island': resolve(import.meta.dirname, 'src/public/chart-island.ts'),
      },
    },
  },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.PORT ?? 3000),
    proxy: {
      // In development the API runs in its own process; same-origin from the browser's view.
      '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false },
    },
  },
});
