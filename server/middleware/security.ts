// Browser-facing protections: the security headers (helmet, with our Content-Security-Policy) and the Origin
// check on state-changing API requests.
import type { NextFunction, Request, Response } from 'express';
import helmet from 'helmet';
import { config } from '@/server/config';
import { HttpError } from '@/server/http';

const https = config.publicUrl.startsWith('https:');

/**
 * The exported web app is one script file (no inline script: `dist/index.html` loads the bundle with a src),
 * the audio worklet is a file of ours (the stretcher inside it compiles WebAssembly), and audio, fonts and images come from this origin; a rendered export
 * is a `blob:` download. Styles need 'unsafe-inline': react-native-web and expo-font write their rules into
 * <style> elements at run time, which no hash can name. The API docs page (development) fits the same rules.
 */
export const securityHeaders = helmet({
  contentSecurityPolicy: {
    useDefaults: false,
    directives: {
      defaultSrc: ["'self'"],
      // 'wasm-unsafe-eval' lets the stretcher compile its WebAssembly (signalsmith-stretch) and nothing else: no JS eval.
      scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
      scriptSrcAttr: ["'none'"],
      styleSrc: ["'self'", "'unsafe-inline'"],
      imgSrc: ["'self'", 'data:', 'blob:'],
      fontSrc: ["'self'", 'data:'],
      mediaSrc: ["'self'", 'blob:'],
      connectSrc: ["'self'"],
      workerSrc: ["'self'", 'blob:'],
      objectSrc: ["'none'"],
      baseUri: ["'self'"],
      formAction: ["'self'"],
      frameAncestors: ["'none'"],
      // Only where the app is reached over https (a local http address would be sent to https and fail).
      ...(https ? { upgradeInsecureRequests: [] } : {}),
    },
  },
  // Browsers ignore it over http; over https it keeps them there.
  strictTransportSecurity: https ? { maxAge: 180 * 24 * 3600 } : false,
  referrerPolicy: { policy: 'strict-origin-when-cross-origin' },
  xFrameOptions: { action: 'deny' },
});

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * A page on another site must not change anything here with the visitor's cookies (SameSite=Lax leaves
 * top-level form POSTs open). Browsers send Origin with every POST, PATCH, PUT and DELETE, so a foreign one is
 * refused. A request with no Origin at all comes from a program (curl, a script), which holds no visitor's
 * cookies to misuse: it is let through and stands or falls by its own session.
 */
export function sameOriginOnly(req: Request, _res: Response, next: NextFunction) {
  const origin = req.get('origin');
  if (SAFE_METHODS.has(req.method) || origin === undefined || config.trustedOrigins.includes(origin)) return next();
  next(
    new HttpError(
      403,
      'foreign_origin',
      'this request came from a page of another site; open Tactus itself and try again',
    ),
  );
}
