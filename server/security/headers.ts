import helmet from 'helmet';
import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import type { Config } from '../config';

// Only a plain host[:port] goes into the policy, so a crafted Host header cannot add directives.
function sameOriginSockets(req: IncomingMessage): string {
  const host = req.headers.host ?? '';
  return /^[A-Za-z0-9.\-[\]:]+$/.test(host) ? `ws://${host} wss://${host}` : '';
}

/**
 * helmet with a content security policy the app runs under: scripts and the solver worker from
 * 'self' only, inline styles (React Flow positions nodes with style attributes), data: and blob:
 * images for exports, the socket.io websocket to the same origin, provider avatars.
 */
export function securityHeaders(config: Config): RequestHandler {
  const production = config.NODE_ENV === 'production';
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:', 'https://avatars.githubusercontent.com'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'", (req) => sameOriginSockets(req)],
        'worker-src': ["'self'", 'blob:'],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'frame-ancestors': ["'none'"],
        'form-action': ["'self'"],
        ...(production ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    strictTransportSecurity: production ? { maxAge: 180 * 24 * 3600 } : false,
    referrerPolicy: { policy: 'same-origin' },
  });
}
