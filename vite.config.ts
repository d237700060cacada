import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { configDefaults, defineConfig } from 'vitest/config';

const apiPort = Number(process.env.API_PORT ?? 3001);
/** tests/pg (several instances on one database) runs only against PostgreSQL: npm run test:pg. */
const postgres = /^postgres(ql)?:\/\//i.test(process.env.DATABASE_URL ?? '');

export default defineConfig({
  plugins: [react(), tailwindcss()],
  // convert-units reads a Node-style `global`; the browser has globalThis.
  define: { global: 'globalThis' },
  build: { outDir: 'dist/client', emptyOutDir: true, sourcemap: false },
  server: {
    port: Number(process.env.PORT ?? 5173),
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    environment: 'node',
    include: ['tests/**/*.test.ts'],
    exclude: [...configDefaults.exclude, ...(postgres ? [] : ['tests/pg/**'])],
    testTimeout: 20_000,
    hookTimeout: 120_000,
    // The browser tests each start the product on its own port; run files one at a time so two
    // Chromium instances never compete for the machine's two cores.
    fileParallelism: false,
    env: { NODE_ENV: 'test' },
  },
});
