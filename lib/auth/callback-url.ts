// next-auth 4 refuses a callbackUrl (query parameter or its callback-url
// cookie) that is not an http(s) URL or a path, and answers that with a 500
// "server configuration" error on every endpoint that reads a session
// (next-auth core/lib/assert.js, isValidHttpUrl). The cookie is sent with
// every request, so one bad cookie broke every signed-in page. The proxy
// checks both first with the same rule.

export const CALLBACK_COOKIES = ["next-auth.callback-url", "__Secure-next-auth.callback-url"] as const;

/** The rule next-auth applies: a path ("/...") on our base, or an absolute http(s) URL. */
export function usableCallbackUrl(value: string): boolean {
  try {
    const url = value.startsWith("/") ? new URL(value, "http://base.invalid") : new URL(value);
    return /^https?:$/.test(url.protocol);
  } catch {
    return false;
  }
}
