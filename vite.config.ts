import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

// The proxy keeps the browser's Origin and Host; the API accepts writes from APP_URL's
// origin, which npm run dev sets to this dev server (http://127.0.0.1:5173).
const apiProxy = {
  '/api': { target: 'http://127.0.0.1:3000', changeOrigin: false },
};

export default defineConfig({
  plugins: [react()],
  build: { outDir: 'dist', emptyOutDir: true },
  server: { proxy: apiProxy },
  preview: { proxy: apiProxy },
});
