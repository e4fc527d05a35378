import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'electron-vite';
import react from '@vitejs/plugin-react';

const root = fileURLToPath(new URL('.', import.meta.url));
const r = (p: string): string => resolve(root, p);
const alias = { '@shared': r('shared') };

export default defineConfig({
  main: {
    resolve: { alias },
    build: {
      outDir: r('out/main'),
      rolldownOptions: {
        input: { index: r('src-main/index.ts'), loopback: r('src-main/loopback/start-browser.ts') },
      },
    },
  },
  preload: {
    resolve: { alias },
    build: {
      outDir: r('out/preload'),
      rolldownOptions: {
        input: { index: r('src-main/preload/index.ts') },
        // Sandboxed preloads must be CommonJS; the package is "type": "module", hence .cjs.
        output: { format: 'cjs', entryFileNames: '[name].cjs', chunkFileNames: 'chunks/[name]-[hash].cjs' },
      },
    },
  },
  renderer: {
    root: r('src-renderer'),
    resolve: { alias },
    plugins: [react()],
    worker: { format: 'es' },
    build: {
      outDir: r('out/renderer'),
      minify: process.env.PLUMBLINE_NO_MINIFY !== '1',
      rolldownOptions: { input: { index: r('src-renderer/index.html') } },
    },
  },
});
