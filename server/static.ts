import express, { type Express } from 'express';
import fs from 'node:fs';
import path from 'node:path';

/** Serves the built client with a single-page-app fallback (client routes resolve to index.html). */
export function mountClient(app: Express, dir: string): void {
  const index = path.join(dir, 'index.html');
  if (!fs.existsSync(index)) {
    app.get('/', (_req, res) => {
      res.status(503).type('text').send('The client is not built yet. Run `npm run build` (npm start does this for you).');
    });
    return;
  }
  app.use(express.static(dir, { index: false, maxAge: '1h', setHeaders: (res, file) => {
    if (file.endsWith('index.html')) res.setHeader('Cache-Control', 'no-cache');
  } }));
  app.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || req.path.startsWith('/auth/') || req.path.startsWith('/socket.io/')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
