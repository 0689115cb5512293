import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// The client is built into dist/client and served by the Express server on one port.
// In development (`npm run dev`) Vite serves the client and forwards /api to the server.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { tsconfigPaths: true },
  build: { outDir: 'dist/client', emptyOutDir: true, chunkSizeWarningLimit: 5000 },
  server: {
    port: 5173,
    host: '127.0.0.1',
    proxy: { '/api': { target: `http://127.0.0.1:${process.env.PORT ?? 3000}` } },
  },
});
