// A tiny static server for the built client (dist/), with the single-page-app fallback: any path
// that is not a file gets index.html. For browser tests that need no API.
import { createReadStream, existsSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import path from 'node:path';

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.json': 'application/json',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
  '.png': 'image/png',
  '.map': 'application/json',
};

export interface StaticServer {
  url: string;
  close(): Promise<void>;
}

/** Serve `root` on 127.0.0.1 at a free port. */
export async function startStaticServer(root: string): Promise<StaticServer> {
  const base = path.resolve(root);
  if (!existsSync(path.join(base, 'index.html'))) throw new Error(`${base}/index.html is missing: run \`npx vite build\` first.`);
  const server: Server = createServer((req, res) => {
    const urlPath = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    let file = path.join(base, urlPath);
    if (!file.startsWith(base) || !existsSync(file) || statSync(file).isDirectory()) file = path.join(base, 'index.html');
    res.writeHead(200, { 'content-type': TYPES[path.extname(file)] ?? 'application/octet-stream', 'cache-control': 'no-store' });
    createReadStream(file).pipe(res);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const addr = server.address();
  const port = typeof addr === 'object' && addr ? addr.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
