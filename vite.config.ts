import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

// The web client lives in client/; the server serves client/dist in production.
// In development `npx vite` proxies /api to the server on PORT (default 8080).
const repo = (p: string) => fileURLToPath(new URL(p, import.meta.url));

export default defineConfig({
  root: repo('./client'),
  publicDir: repo('./client/public'),
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@shared': repo('./shared') } },
  build: {
    outDir: repo('./client/dist'),
    emptyOutDir: true,
    sourcemap: true,
  },
  server: {
    host: '127.0.0.1',
    proxy: {
      '/api': { target: `http://127.0.0.1:${process.env.PORT ?? 8080}`, changeOrigin: false },
    },
  },
  preview: { host: '127.0.0.1' },
});
