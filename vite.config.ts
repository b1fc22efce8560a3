import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { PALETTE } from './shared/palette';

const apiPort = Number(process.env.API_PORT ?? process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // The offline shell: our own worker (src/offline-shell/sw.ts) with the build's precache
    // manifest injected; registered by src/offline-shell/register.ts, updates wait for "Reload".
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'src/offline-shell',
      filename: 'sw.ts',
      registerType: 'prompt',
      injectRegister: false,
      // Every browser that runs the worker reads woff2, so the older .woff copies stay out of the
      // precache, as do the font subsets for scripts other than Latin (fetched when a page needs them).
      injectManifest: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
        globIgnores: ['**/*-{cyrillic,cyrillic-ext,greek,greek-ext,vietnamese}-*.woff2'],
        maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
      },
      manifest: {
        name: 'Quiltline',
        short_name: 'Quiltline',
        description: 'Loft insulation takeoffs, quotes and job sheets',
        start_url: '/',
        scope: '/',
        lang: 'en-GB',
        display: 'standalone',
        theme_color: PALETTE.paper,
        background_color: PALETTE.paper,
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
    }),
  ],
  server: {
    port: Number(process.env.VITE_PORT ?? 5173),
    host: '127.0.0.1',
    // /q and /pay: the customer's quote and payment pages, served by the API.
    proxy: { '/api': `http://127.0.0.1:${apiPort}`, '/q': `http://127.0.0.1:${apiPort}`, '/pay': `http://127.0.0.1:${apiPort}` },
  },
  build: { outDir: 'dist', sourcemap: false, chunkSizeWarningLimit: 800 },
});
