import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

// The console. `npm start` serves the built files from dist/ on the API's port;
// `npm run dev` serves it with hot reload and forwards /api to the API on :3000.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  // The Host header is kept (changeOrigin: false) so the API's cross-site check sees the console's
  // own origin on writes sent from it.
  server: { proxy: { '/api': { target: 'http://127.0.0.1:3000', changeOrigin: false } } },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // The API reference page (swagger-ui) is a large chunk, loaded only on that page.
    chunkSizeWarningLimit: 2500,
  },
});
