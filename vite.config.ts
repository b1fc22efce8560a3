import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const apiPort = Number(process.env.API_PORT ?? process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    port: Number(process.env.VITE_PORT ?? 5173),
    host: '127.0.0.1',
    // /q and /pay: the customer's quote and payment pages, served by the API.
    proxy: { '/api': `http://127.0.0.1:${apiPort}`, '/q': `http://127.0.0.1:${apiPort}`, '/pay': `http://127.0.0.1:${apiPort}` },
  },
  build: { outDir: 'dist', sourcemap: false, chunkSizeWarningLimit: 800 },
});
