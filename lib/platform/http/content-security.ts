/**
 * The Content-Security-Policy of the screens. Scripts run only with this response's nonce
 * ('strict-dynamic' lets the framework's own loader add its chunks); no 'unsafe-inline' and no
 * 'unsafe-eval' for scripts outside `next dev`, whose React refresh needs eval. Styles keep
 * 'unsafe-inline': the editor and the plots set element styles at run time.
 */
export function screenPolicy(nonce: string, dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "worker-src 'self' blob:",
    "connect-src 'self'",
    "frame-ancestors 'none'",
    "form-action 'self'",
    "base-uri 'self'",
    "object-src 'none'",
  ].join("; ");
}

/** A fresh, unguessable nonce per response (128 bits, base64). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  let s = "";
  for (const b of bytes) s += String.fromCharCode(b);
  return btoa(s);
}
