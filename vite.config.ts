import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

// The API server checks Origin against Host, so the proxy must keep the browser's Host
// (changeOrigin: false) for cookie-carrying writes to pass in development.
const apiProxy = {
  '/api': { target: 'http://127.0.0.1:3000', changeOrigin: false },
};

export default defineConfig({
  plugins: [react()],
  build: { outDir: 'dist', emptyOutDir: true },
  server: { proxy: apiProxy },
  preview: { proxy: apiProxy },
});
