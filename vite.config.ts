import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const apiPort = Number(process.env.API_PORT ?? 5174);
const api = `http://127.0.0.1:${apiPort}`;

// In `npm run dev` the API runs beside Vite and is proxied; in `npm start` one Express serves both.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: {
      '/api': api,
      '/auth': api,
      '/fake-oauth': api,
      '/dev': api,
      '/socket.io': { target: api, ws: true },
    },
  },
  worker: { format: 'es' },
  build: { outDir: 'dist', sourcemap: true, chunkSizeWarningLimit: 1500 },
});
