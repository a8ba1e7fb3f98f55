// Vite config of the map harness page (test only, not shipped): serves map.html on 127.0.0.1:5347.
// Run: npx vite --config test/e2e/harness/map.vite.config.ts   then open http://127.0.0.1:5347/map.html
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const harnessRoot = fileURLToPath(new URL('.', import.meta.url));
const repositoryRoot = fileURLToPath(new URL('../../..', import.meta.url));

export default defineConfig({
  root: harnessRoot,
  base: './',
  plugins: [react()],
  server: { host: '127.0.0.1', port: 5347, strictPort: true, fs: { allow: [repositoryRoot] } },
  preview: { host: '127.0.0.1', port: 5347, strictPort: true },
  build: { outDir: fileURLToPath(new URL('../../../.tmp/map-harness', import.meta.url)), emptyOutDir: true, rollupOptions: { input: fileURLToPath(new URL('./map.html', import.meta.url)) } },
});
