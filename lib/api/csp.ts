// Content security policy for pages: scripts run only with this response's
// nonce (Next.js puts it on its own scripts when it finds 'nonce-...' in the
// request's policy; see the Next.js guide "Content Security Policy"), and
// 'strict-dynamic' lets those scripts load the page's chunks (CSP Level 3,
// section 8.2). No 'unsafe-inline' for scripts. Styles keep 'unsafe-inline':
// the charts set style attributes, which a nonce cannot cover. 'unsafe-eval'
// only under `next dev` (React's development build needs it).

export function pagePolicy(nonce: string, dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    `connect-src 'self'${dev ? " ws: wss:" : ""}`,
    "frame-ancestors 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "object-src 'none'",
  ].join("; ");
}

/** For answers that are not pages (API JSON, files): nothing may run. */
export const NON_PAGE_POLICY = [
  "default-src 'self'",
  "script-src 'none'",
  "style-src 'self' 'unsafe-inline'",
  "frame-ancestors 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "object-src 'none'",
].join("; ");

/** 16 random bytes, base64 (CSP nonces: at least 128 bits, CSP Level 3 section 7.1). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
