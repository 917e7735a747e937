import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';
import vuetify from 'vite-plugin-vuetify';

const apiTarget = process.env.BREAKOVER_API_URL ?? 'http://127.0.0.1:3000';

export default defineConfig({
  plugins: [vue(), vuetify({ autoImport: true })],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    chunkSizeWarningLimit: 600,
  },
  test: {
    // Each project maps to one folder of tests/; the database tests get a fresh database per file.
    testTimeout: 30_000,
    hookTimeout: 60_000,
    projects: [
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      { extends: true, test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node' } },
      {
        extends: true,
        test: {
          name: 'web',
          include: ['tests/web/**/*.test.ts'],
          environment: 'happy-dom',
          server: { deps: { inline: ['vuetify'] } },
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
