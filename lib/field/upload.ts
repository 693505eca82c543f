import "server-only";
// Capture upload: the request body goes straight into measureCsv while the
// same chunks are collected once for storage. The size limit is enforced on
// the bytes as they arrive, with or without a Content-Length header.
import { createHash } from "node:crypto";
import { ApiError } from "@/lib/api/errors";
import { cleanLine } from "@/lib/validation/plain-text";
import {
  CaptureError,
  measureTrace,
  parseCapture,
  type CaptureMeasurement,
  type CaptureOptions,
  type CaptureTrace,
} from "@/lib/capture";
import { boundaryOf, multipartFile } from "./multipart";

/** Room for the form's own headers and delimiters around the file. */
const FORM_OVERHEAD = 64 * 1024;

export function formatLimit(n: number): string {
  if (n >= 1 << 20 && n % (1 << 20) === 0) return `${n / (1 << 20)} MiB`;
  if (n >= 1024 && n % 1024 === 0) return `${n / 1024} KiB`;
  return `${n} bytes`;
}

function tooLarge(maxBytes: number, line?: number | null): ApiError {
  const where = line ? ` (reading stopped at line ${line})` : "";
  return new ApiError(
    "payload_too_large",
    `The capture is larger than the ${formatLimit(maxBytes)} limit${where}. Export a shorter record or fewer channels.`,
  );
}

/** One growing buffer; sized from Content-Length when the client sent it. */
class Collector {
  private buf: Buffer;
  length = 0;
  constructor(hint: number) {
    this.buf = Buffer.allocUnsafe(Math.max(4096, hint));
  }
  push(chunk: Uint8Array) {
    if (this.length + chunk.length > this.buf.length) {
      const bigger = Buffer.allocUnsafe(Math.max(this.length + chunk.length, this.buf.length * 2));
      this.buf.copy(bigger, 0, 0, this.length);
      this.buf = bigger;
    }
    this.buf.set(chunk, this.length);
    this.length += chunk.length;
  }
  bytes(): Buffer {
    return this.buf.subarray(0, this.length);
  }
}

/** Counts raw body bytes; a body far past the limit is cut off early. */
async function* capped(body: AsyncIterable<Uint8Array>, maxRaw: number, maxBytes: number) {
  let n = 0;
  for await (const chunk of body) {
    n += chunk.length;
    if (n > maxRaw) throw tooLarge(maxBytes);
    yield chunk;
  }
}

export type MeasuredUpload = {
  fileName: string;
  content: Buffer;
  sha256: string;
  measurement: CaptureMeasurement;
  /** The parsed samples, kept so the stored levels are made from this one parse. */
  trace: Pick<CaptureTrace, "t" | "v">;
};

/** A channel or probe the file cannot have: 422 naming the form field. */
export function choiceError(e: CaptureError): ApiError {
  const text = `${e.message.charAt(0).toUpperCase()}${e.message.slice(1)}.`;
  return new ApiError("unprocessable", text, { [/probe/.test(e.message) ? "probe" : "channel"]: text });
}

/** The name as sent, without folders, line breaks, controls or bidi controls; quotes are kept. */
export function cleanName(raw: string | null | undefined): string {
  const base = (raw ?? "").split(/[\\/]/).pop() ?? "";
  const safe = cleanLine(base.replace(/[\u0000-\u0009\u000b\u000c\u000e-\u001f\u007f]/g, ""));
  return Array.from(safe).slice(0, 200).join("") || "capture.csv";
}

/** Measures and collects an upload: multipart/form-data (part "file") or a raw
 *  text body. Throws ApiError 413/422/400; nothing is stored here. */
export async function readCaptureUpload(
  req: Request,
  maxBytes: number,
  options: CaptureOptions = {},
): Promise<MeasuredUpload> {
  const type = req.headers.get("content-type") ?? "";
  const multipart = /^multipart\/form-data/i.test(type);
  const declared = Number(req.headers.get("content-length") ?? NaN);
  // A declared length past the limit is refused before reading. While
  // streaming, measureCsv enforces the exact limit on the file's bytes (and
  // names the line); the raw cap only stops a form with huge other parts.
  if (Number.isFinite(declared) && declared > maxBytes + (multipart ? FORM_OVERHEAD : 0))
    throw tooLarge(maxBytes);
  const maxRaw = maxBytes + FORM_OVERHEAD;
  if (!req.body)
    throw new ApiError("unprocessable", "line 1: the capture is empty; choose a CSV or TSV export.");

  const raw = capped(req.body as unknown as AsyncIterable<Uint8Array>, maxRaw, maxBytes);
  const found = { fileName: null as string | null };
  let source: AsyncIterable<Uint8Array>;
  if (multipart) {
    const boundary = boundaryOf(type);
    if (!boundary) throw new ApiError("bad_request", "The multipart body has no boundary.");
    source = multipartFile(raw, boundary, "file", found);
  } else {
    source = raw;
  }

  const hash = createHash("sha256");
  const store = new Collector(Number.isFinite(declared) ? Math.min(declared, maxBytes) : 1 << 20);
  async function* tee() {
    for await (const chunk of source) {
      // measureCsv counts the chunk against the limit when it takes it; the
      // chunk is kept only once that has passed, so storage stays in bounds.
      yield chunk;
      store.push(chunk);
      hash.update(chunk);
    }
  }
  let measurement: CaptureMeasurement;
  let trace: CaptureTrace;
  try {
    trace = await parseCapture(tee(), { ...options, maxBytes });
    measurement = measureTrace(trace);
  } catch (e) {
    if (e instanceof CaptureError) {
      if (e.code === "too-large") throw tooLarge(maxBytes, e.line);
      if (e.code === "bad-choice") throw choiceError(e);
      throw new ApiError(
        "unprocessable",
        `${e.message.replace(/\.$/, "")}. Check the export settings (CSV or TSV, time and voltage columns).`,
        {
          file: e.message,
        },
      );
    }
    throw e;
  }
  const fileName = cleanName(
    multipart
      ? found.fileName
      : (req.headers.get("x-file-name") ?? new URL(req.url).searchParams.get("name")),
  );
  return { fileName, content: store.bytes(), sha256: hash.digest("hex"), measurement, trace };
}
