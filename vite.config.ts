import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const root = fileURLToPath(new URL('.', import.meta.url));

// Libraries that change rarely get their own chunks so a release of app code does not bust their cache.
const vendorGroups = [
  { name: 'react', test: /node_modules[\\/](react|react-dom|scheduler)[\\/]/, priority: 5 },
  { name: 'router', test: /node_modules[\\/](react-router|react-router-dom|cookie|set-cookie-parser)[\\/]/, priority: 4 },
  { name: 'query', test: /node_modules[\\/]@tanstack[\\/](query-core|react-query)[\\/]/, priority: 4 },
  { name: 'table', test: /node_modules[\\/]@tanstack[\\/](table-core|react-table|react-store|store)[\\/]/, priority: 4 },
  { name: 'forms', test: /node_modules[\\/](react-hook-form|@hookform)[\\/]/, priority: 4 },
  { name: 'casl', test: /node_modules[\\/]@casl[\\/]/, priority: 4 },
  { name: 'zod', test: /node_modules[\\/]zod[\\/]/, priority: 4 },
];

export default defineConfig({
  root,
  publicDir: 'web/public',
  plugins: [react(), tailwindcss()],
  resolve: { tsconfigPaths: true },
  server: {
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: 'http://127.0.0.1:3000' }, '/supplier-api': { target: 'http://127.0.0.1:3000' } },
  },
  build: {
    outDir: 'dist/web',
    emptyOutDir: true,
    rolldownOptions: {
      output: { codeSplitting: { groups: vendorGroups } },
    },
  },
});
