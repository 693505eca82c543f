// Browser-side bundle check: the digest function must give the published
// SHA-256 test vectors, and the comparison must tell a match from a one-bit slip.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { compareSha, sha256Hex } from "@/lib/field/sha-verify";

const enc = new TextEncoder();

describe("sha256Hex", () => {
  it('gives the FIPS 180-2 example digest of "abc"', async () => {
    // FIPS 180-2, Appendix B.1 (SHA-256 example, one-block message "abc").
    expect(await sha256Hex(enc.encode("abc"))).toBe(
      "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
    );
  });

  it("gives the FIPS 180-2 two-block example digest", async () => {
    // FIPS 180-2, Appendix B.2 (448-bit message "abcdbcde...nopq").
    expect(await sha256Hex(enc.encode("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq"))).toBe(
      "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
    );
  });

  it("agrees with OpenSSL (node:crypto) on a zip-sized buffer and on an ArrayBuffer", async () => {
    // Reference: OpenSSL's SHA-256 through node:crypto; 70 kB of varied bytes like a bundle.
    const bytes = new Uint8Array(70_001).map((_, i) => (i * 31 + (i >> 7)) & 0xff);
    const ref = createHash("sha256").update(bytes).digest("hex");
    expect(await sha256Hex(bytes)).toBe(ref);
    expect(await sha256Hex(bytes.buffer)).toBe(ref);
  });
});

describe("compareSha", () => {
  const abc = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

  it("accepts the same digest pasted in upper case with spaces or colons", () => {
    expect(compareSha(abc.toUpperCase(), abc).kind).toBe("match");
    expect(compareSha(abc.match(/../g)!.join(":"), abc).kind).toBe("match");
    expect(compareSha(`  ${abc.slice(0, 32)} ${abc.slice(32)}\n`, abc).kind).toBe("match");
  });

  it("reports a mismatch when one hex digit differs", () => {
    const slipped = abc.slice(0, 63) + "c";
    const v = compareSha(slipped, abc);
    expect(v).toEqual({ kind: "mismatch", actual: abc, expected: slipped });
  });

  it("refuses an expected value that is not 64 hex digits, saying so", () => {
    const short = compareSha(abc.slice(0, 12), abc);
    expect(short.kind).toBe("bad-expected");
    expect(short.kind === "bad-expected" && short.message).toMatch(/64 hexadecimal digits; got 12/);
    expect(compareSha("z".repeat(64), abc).kind).toBe("bad-expected");
  });
});
