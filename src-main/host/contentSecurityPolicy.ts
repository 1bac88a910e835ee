/**
 * The renderer's Content-Security-Policy, the same under Electron and the browser host: only
 * our own scripts and styles, no eval, no remote anything. uPlot sets inline style attributes,
 * hence 'unsafe-inline' for styles only.
 */
export const contentSecurityPolicy = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');
