import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import { quasar, transformAssetUrls } from '@quasar/vite-plugin'

// The client is built once and served by the Express app (scripts/start); `vite` alone is the
// development server and forwards /api to the API on port 3000.
export default defineConfig({
  plugins: [vue({ template: { transformAssetUrls } }), quasar({ sassVariables: false })],
  server: {
    host: '127.0.0.1',
    proxy: { '/api': 'http://127.0.0.1:3000' },
  },
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    chunkSizeWarningLimit: 800,
    // Which chunk holds what: scripts/bench/client-bundle.ts reads it to size the first screen.
    manifest: true,
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            // Vite's preload helper is a dependency of every lazy import (ol's own included);
            // without this group it would be captured into the ol chunk, and the entry with it.
            { name: 'preload-helper', test: /preload-helper/, priority: 2 },
            // OpenLayers and its own dependencies in one chunk of their own: only the map
            // screens load it, and it stays cached across releases that do not touch it.
            {
              name: 'ol',
              priority: 1,
              test: /[\\/]node_modules[\\/](ol|rbush|quickselect|earcut|pbf)[\\/]/,
            },
          ],
        },
      },
    },
  },
})
