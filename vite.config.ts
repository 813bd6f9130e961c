import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

// The console. `npm start` serves the built files from dist/ on the API's port;
// `npx vite` serves it with hot reload and forwards /api to a running server on :3000.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: { proxy: { '/api': 'http://localhost:3000' } },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // The API reference page (swagger-ui) is a large chunk, loaded only on that page.
    chunkSizeWarningLimit: 2500,
  },
});
