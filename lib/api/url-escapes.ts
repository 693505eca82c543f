// A percent escape that does not decode (RFC 3986 section 2.1: "%" and two hex
// digits; the bytes must form UTF-8, RFC 3629) makes the router refuse the
// request with its own HTML page, or decodeURIComponent throw in a handler.
// The proxy answers such API paths with our error shape instead.

/** The first path segment whose percent escapes do not decode, or null. */
export function brokenEscapeSegment(pathname: string): string | null {
  for (const segment of pathname.split("/")) {
    if (!segment.includes("%")) continue;
    try {
      decodeURIComponent(segment);
    } catch {
      return segment;
    }
  }
  return null;
}

/** decodeURIComponent that answers null instead of throwing URIError. */
export function decodeOrNull(text: string): string | null {
  try {
    return decodeURIComponent(text);
  } catch {
    return null;
  }
}
