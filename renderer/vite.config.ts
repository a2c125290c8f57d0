import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

// The renderer is a plain web page; it reaches the app only through window.eggline.
export default defineConfig({
  root: fileURLToPath(new URL('.', import.meta.url)),
  base: './',
  plugins: [react()],
  build: {
    outDir: fileURLToPath(new URL('../dist/renderer', import.meta.url)),
    emptyOutDir: true,
    sourcemap: true,
    target: 'chrome130',
    // One bundle for a desktop app loaded from disk; splitting would not make it start faster.
    chunkSizeWarningLimit: 1500,
  },
});
