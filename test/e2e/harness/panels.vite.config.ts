// Vite config of the panels harness page (test only, not shipped): serves panels.html on 127.0.0.1:5361.
// Run: npx vite --config test/e2e/harness/panels.vite.config.ts   then open http://127.0.0.1:5361/panels.html
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const harnessRoot = fileURLToPath(new URL('.', import.meta.url));
const repositoryRoot = fileURLToPath(new URL('../../..', import.meta.url));

export default defineConfig({
  root: harnessRoot,
  base: './',
  plugins: [react()],
  server: { host: '127.0.0.1', port: 5361, strictPort: true, fs: { allow: [repositoryRoot] } },
  preview: { host: '127.0.0.1', port: 5361, strictPort: true },
  build: { outDir: fileURLToPath(new URL('../../../.tmp/panels-harness', import.meta.url)), emptyOutDir: true, rollupOptions: { input: fileURLToPath(new URL('./panels.html', import.meta.url)) } },
});
