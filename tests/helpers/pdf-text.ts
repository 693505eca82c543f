// The text a PDF draws, read back with pdf-lib (parse) and zlib (FlateDecode,
// ISO 32000-1 7.4.4): every page's content stream inflated and its string
// operands of Tj (literal or hex, 7.3.4) decoded as single-byte text.
import { inflateSync } from "node:zlib";
import { PDFArray, PDFDocument, PDFName, PDFRawStream, type PDFRef } from "pdf-lib";

function streamBytes(s: PDFRawStream): Buffer {
  const filter = s.dict.get(PDFName.of("Filter"));
  const raw = Buffer.from(s.getContents());
  return filter?.toString() === "/FlateDecode" ? inflateSync(raw) : raw;
}

function strings(content: string): string[] {
  const out: string[] = [];
  for (const m of content.matchAll(/<([0-9A-Fa-f\s]*)>\s*Tj|\(((?:\\.|[^\\)])*)\)\s*Tj/g)) {
    if (m[1] !== undefined) out.push(Buffer.from(m[1].replace(/\s/g, ""), "hex").toString("latin1"));
    else out.push(m[2].replace(/\\([()\\])/g, "$1"));
  }
  return out;
}

export async function pdfText(bytes: Uint8Array): Promise<{ doc: PDFDocument; pages: string[] }> {
  const doc = await PDFDocument.load(bytes);
  const pages = doc.getPages().map((page) => {
    const contents = page.node.Contents();
    const list = contents instanceof PDFArray ? contents.asArray() : contents ? [contents] : [];
    return list
      .map((ref) => doc.context.lookup(ref as PDFRef))
      .filter((s): s is PDFRawStream => s instanceof PDFRawStream)
      .map((s) => strings(streamBytes(s).toString("latin1")).join("\n"))
      .join("\n");
  });
  return { doc, pages };
}
