// A streaming reader for one file part of a multipart/form-data body (RFC 7578).
// The file's bytes are passed on as they arrive; only a delimiter-sized tail
// is held back, so a large upload is never buffered whole.
import { dispositionParams, uploadFileName } from "@/lib/api/content-disposition";
import { ApiError } from "@/lib/api/errors";

const CRLF2 = new TextEncoder().encode("\r\n\r\n");
/** Part headers longer than this are not a browser's form (common practice, no source). */
const MAX_HEADER_BYTES = 16 * 1024;

export function boundaryOf(contentType: string): string | null {
  const m = /boundary=(?:"([^"]+)"|([^;\s]+))/i.exec(contentType);
  return m ? (m[1] ?? m[2]) : null;
}

function indexOf(hay: Uint8Array, needle: Uint8Array, from = 0): number {
  const first = needle[0];
  outer: for (
    let i = hay.indexOf(first, from);
    i !== -1 && i <= hay.length - needle.length;
    i = hay.indexOf(first, i + 1)
  ) {
    for (let j = 1; j < needle.length; j++) if (hay[i + j] !== needle[j]) continue outer;
    return i;
  }
  return -1;
}

function join(a: Uint8Array, b: Uint8Array): Uint8Array {
  if (!a.length) return b;
  const out = new Uint8Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}

function partInfo(headers: string): { name: string | null; fileName: string | null } {
  const disposition = /content-disposition:([^\r\n]*)/i.exec(headers)?.[1] ?? "";
  // Quoted names may hold escaped quotes; a name with a quote is kept whole.
  return { name: dispositionParams(disposition).name ?? null, fileName: uploadFileName(disposition) };
}

/**
 * Yields the bytes of the part named `field`; `found.fileName` is set once its
 * headers are read. Other parts are skipped. 400 when the part is missing.
 */
export async function* multipartFile(
  body: AsyncIterable<Uint8Array>,
  boundary: string,
  field: string,
  found: { fileName: string | null },
): AsyncGenerator<Uint8Array> {
  const enc = new TextEncoder();
  const first = enc.encode(`--${boundary}`);
  const delimiter = enc.encode(`\r\n--${boundary}`);
  let buf: Uint8Array = new Uint8Array(0);
  let phase: "preamble" | "headers" | "body" = "preamble";
  let wanted = false;
  for await (const chunk of body) {
    buf = join(buf, chunk);
    for (;;) {
      if (phase === "preamble") {
        const at = indexOf(buf, first);
        if (at === -1) {
          buf = buf.slice(Math.max(0, buf.length - first.length));
          break;
        }
        buf = buf.slice(at + first.length);
        phase = "headers";
      } else if (phase === "headers") {
        const end = indexOf(buf, CRLF2);
        if (end === -1) {
          if (buf.length > MAX_HEADER_BYTES)
            throw new ApiError("bad_request", "A form part has headers that are too long.");
          break;
        }
        const head = new TextDecoder().decode(buf.subarray(0, end));
        if (head.startsWith("--")) return; // closing delimiter: no more parts
        const info = partInfo(head);
        wanted = info.name === field;
        if (wanted) found.fileName = info.fileName ?? "";
        buf = buf.slice(end + CRLF2.length);
        phase = "body";
      } else {
        const at = indexOf(buf, delimiter);
        if (at === -1) {
          // Keep what could be the start of the delimiter; pass on the rest.
          const keep = Math.min(buf.length, delimiter.length - 1);
          if (wanted && buf.length > keep) yield buf.subarray(0, buf.length - keep);
          buf = buf.slice(buf.length - keep);
          break;
        }
        if (wanted) {
          if (at > 0) yield buf.subarray(0, at);
          return;
        }
        buf = buf.slice(at + delimiter.length);
        phase = "headers";
      }
    }
  }
  if (!wanted)
    throw new ApiError(
      "bad_request",
      `The form has no "${field}" part; send the capture file as "${field}".`,
    );
}
