// Vite builds the renderer (React + Konva) into dist-web/, loadable from file: (Electron) or served on 127.0.0.1 (web mode).
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  root: fileURLToPath(new URL('./renderer', import.meta.url)),
  base: './',
  plugins: [react()],
  build: {
    outDir: fileURLToPath(new URL('./dist-web', import.meta.url)),
    emptyOutDir: true,
    // One bundle for a desktop app loaded from disk or localhost; its size is not a download concern.
    chunkSizeWarningLimit: 4000,
    sourcemap: true,
  },
  server: { host: '127.0.0.1', port: 5173, strictPort: false },
  preview: { host: '127.0.0.1', port: 5173, strictPort: false },
});
