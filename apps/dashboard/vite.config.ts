import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// In development the dashboard runs on Vite's server and proxies the API to the app server.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    port: 5173,
    proxy: { '/api': 'http://127.0.0.1:5180' },
  },
  build: { outDir: 'dist', sourcemap: true },
});
