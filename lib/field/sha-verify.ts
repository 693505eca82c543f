// Hashing a downloaded bundle where the technician stands: Web Crypto in the
// browser (no upload, no server round trip), compared with the sha256 the
// reviewer approved. Pure so that the same code runs under vitest in Node.

export type ShaVerdict =
  | { kind: "match"; actual: string }
  | { kind: "mismatch"; actual: string; expected: string }
  | { kind: "bad-expected"; message: string };

const HEX64 = /^[0-9a-f]{64}$/;

/** Lower-case hex sha256 of the bytes, using the platform's SubtleCrypto. */
export async function sha256Hex(bytes: ArrayBuffer | Uint8Array): Promise<string> {
  const subtle = globalThis.crypto?.subtle;
  if (!subtle) throw new Error("This browser cannot hash files here (no Web Crypto); use sha256sum instead.");
  const view = bytes instanceof Uint8Array ? bytes : new Uint8Array(bytes);
  const digest = await subtle.digest("SHA-256", view as Uint8Array<ArrayBuffer>);
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
}

/**
 * Compares a computed digest with the expected one. The expected value may be
 * pasted with spaces, colons or upper case (as some tools print it); anything
 * that is not 64 hex digits after that is refused with a message.
 */
export function compareSha(expected: string, actual: string): ShaVerdict {
  const want = expected.replace(/[\s:]/g, "").toLowerCase();
  if (!HEX64.test(want)) {
    return {
      kind: "bad-expected",
      message: `Expected sha256 must be 64 hexadecimal digits; got ${want.length} characters.`,
    };
  }
  return want === actual ? { kind: "match", actual } : { kind: "mismatch", actual, expected: want };
}
