// Turns the upload (a string or a stream of byte / text chunks) into decoded
// text chunks, counting bytes against the size limit as they arrive so an
// oversized upload is refused before it is read to the end.

import { CaptureError } from "./errors";

export const MAX_CAPTURE_BYTES = 64 * 1024 * 1024;

// Big strings are walked in slices so the byte limit is checked as we go and
// the line splitter sees chunks of a bounded size.
const STRING_SLICE = 1 << 20;

const NON_ASCII = /[^\u0000-\u007f]/;

/** UTF-8 length of a string without encoding it. */
export function utf8Length(s: string): number {
  if (!NON_ASCII.test(s)) return s.length;
  let bytes = 0;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

async function* sliceString(s: string): AsyncGenerator<string> {
  let at = 0;
  while (at < s.length) {
    let end = Math.min(s.length, at + STRING_SLICE);
    // Never split a surrogate pair.
    if (end < s.length && (s.charCodeAt(end - 1) & 0xfc00) === 0xd800) end++;
    yield s.slice(at, end);
    at = end;
  }
}

/** Picks the decoder from a byte-order mark; UTF-8 otherwise. */
function decoderFor(first: Uint8Array): TextDecoder {
  if (first[0] === 0xff && first[1] === 0xfe) return new TextDecoder("utf-16le");
  if (first[0] === 0xfe && first[1] === 0xff) return new TextDecoder("utf-16be");
  return new TextDecoder("utf-8");
}

/**
 * Yields decoded text. `currentLine` reports where reading has got to, so a
 * size error can name the line.
 */
export async function* textChunks(
  source: string | AsyncIterable<Uint8Array | string>,
  maxBytes: number,
  currentLine: () => number,
): AsyncGenerator<string> {
  const input = typeof source === "string" ? sliceString(source) : source;
  let bytes = 0;
  let decoder: TextDecoder | null = null;
  let pending: Uint8Array | null = null; // a lone first byte, until the BOM is decidable
  const count = (n: number) => {
    bytes += n;
    if (bytes > maxBytes) {
      throw new CaptureError(
        "too-large",
        currentLine(),
        `the capture is larger than the ${formatBytes(maxBytes)} limit`,
      );
    }
  };
  for await (const chunk of input) {
    if (typeof chunk === "string") {
      count(utf8Length(chunk));
      yield decoder ? decoder.decode() + chunk : chunk;
      continue;
    }
    count(chunk.byteLength);
    let data = chunk;
    if (pending) {
      data = new Uint8Array(pending.length + chunk.length);
      data.set(pending);
      data.set(chunk, pending.length);
      pending = null;
    }
    if (!decoder) {
      if (data.length < 2) {
        pending = data;
        continue;
      }
      decoder = decoderFor(data);
    }
    const text = decoder.decode(data, { stream: true });
    if (text) yield text;
  }
  if (pending) decoder = decoderFor(pending);
  if (decoder) {
    const tail = decoder.decode(pending ?? undefined);
    if (tail) yield tail;
  }
}

function formatBytes(n: number): string {
  if (n >= 1 << 20 && n % (1 << 20) === 0) return `${n / (1 << 20)} MiB`;
  if (n >= 1024 && n % 1024 === 0) return `${n / 1024} KiB`;
  return `${n} bytes`;
}
