import type { RequestHandler } from 'express';
import helmet from 'helmet';

/** Helmet with a CSP the exported web app passes (react-native-web injects styles at run time). */
export function securityHeaders(opts: { scriptHashes: string[]; tls: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'", ...opts.scriptHashes],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        ...(opts.tls ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    strictTransportSecurity: opts.tls ? { maxAge: 15552000, includeSubDomains: true } : false,
    crossOriginEmbedderPolicy: false,
  });
}
