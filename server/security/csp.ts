/**
 * The Content-Security-Policy of the app (helmet). Scripts only from our origin, no inline
 * scripts; inline styles are allowed because Vuetify and ag-grid set style attributes;
 * fonts and icons ship with the app; three.js and the grid use blob: workers/images.
 */
export const CONTENT_SECURITY_POLICY: Record<string, string[]> = {
  'default-src': ["'self'"],
  'base-uri': ["'self'"],
  'script-src': ["'self'"],
  'script-src-attr': ["'none'"],
  'style-src': ["'self'", "'unsafe-inline'"],
  'img-src': ["'self'", 'data:', 'blob:'],
  'font-src': ["'self'", 'data:'],
  'connect-src': ["'self'"],
  'worker-src': ["'self'", 'blob:'],
  'object-src': ["'none'"],
  'frame-ancestors': ["'none'"],
  'form-action': ["'self'"],
};
