// Shared Vite config of the harness pages (test only, not shipped): one page served on 127.0.0.1 at its own port.
import { defineConfig, type UserConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const harnessRoot = fileURLToPath(new URL('.', import.meta.url));
const repositoryRoot = fileURLToPath(new URL('../../..', import.meta.url));

export function harnessViteConfig(page: string, port: number): UserConfig {
  return defineConfig({
    root: harnessRoot,
    base: './',
    plugins: [react()],
    server: { host: '127.0.0.1', port, strictPort: true, fs: { allow: [repositoryRoot] } },
    preview: { host: '127.0.0.1', port, strictPort: true },
    build: { outDir: fileURLToPath(new URL(`../../../.tmp/${page}-harness`, import.meta.url)), emptyOutDir: true, rollupOptions: { input: fileURLToPath(new URL(`./${page}.html`, import.meta.url)) } },
  });
}
