// A signed field check as a PDF for the site's files: what was checked
// (retrofit, site, asset, board, revision and bundle sha256, target and
// device), the cautions, every judged line and checklist line with its note
// and photo, and who signed it when. Made with pdf-lib's standard Helvetica
// (WinAnsi text; other characters are spelled out or replaced).
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { formatEng, type EngUnit } from "@/lib/engine";
import type { FieldCheckView, StepResult } from "./shapes";

export type RecordContext = {
  check: FieldCheckView;
  site: string;
  bundleSha256: string;
  deviceName: string;
  cautions: string[];
  photos: Map<number, { mediaType: string; content: Uint8Array }>;
};

const A4: [number, number] = [595.28, 841.89];
const MARGIN = 50;
const SPELLED: Record<string, string> = {
  Ω: "Ohm",
  "✓": "ok",
  "✗": "x",
  "→": "->",
  "≤": "<=",
  "≥": ">=",
  "−": "-",
};

/** Text Helvetica can draw: known symbols spelled out, anything else outside WinAnsi as "?". */
export function pdfText(font: PDFFont, text: string): string {
  let out = "";
  for (const ch of text.replace(/\r/g, "")) {
    const c = SPELLED[ch] ?? ch;
    try {
      font.encodeText(c);
      out += c;
    } catch {
      out += "?";
    }
  }
  return out;
}

class Writer {
  page: PDFPage;
  y: number;
  constructor(
    readonly doc: PDFDocument,
    readonly font: PDFFont,
    readonly bold: PDFFont,
  ) {
    this.page = doc.addPage(A4);
    this.y = A4[1] - MARGIN;
  }
  need(h: number) {
    if (this.y - h < MARGIN) {
      this.page = this.doc.addPage(A4);
      this.y = A4[1] - MARGIN;
    }
  }
  wrap(text: string, font: PDFFont, size: number, width: number): string[] {
    const lines: string[] = [];
    for (const para of pdfText(font, text).split("\n")) {
      let line = "";
      for (const word of para.split(/\s+/)) {
        const next = line ? `${line} ${word}` : word;
        if (font.widthOfTextAtSize(next, size) <= width || !line) line = next;
        else {
          lines.push(line);
          line = word;
        }
      }
      lines.push(line);
    }
    return lines;
  }
  text(
    text: string,
    opts: { size?: number; bold?: boolean; indent?: number; color?: [number, number, number] } = {},
  ) {
    const size = opts.size ?? 10;
    const font = opts.bold ? this.bold : this.font;
    const x = MARGIN + (opts.indent ?? 0);
    for (const line of this.wrap(text, font, size, A4[0] - MARGIN - x)) {
      this.need(size * 1.35);
      this.page.drawText(line, { x, y: this.y - size, size, font, color: rgb(...(opts.color ?? [0, 0, 0])) });
      this.y -= size * 1.35;
    }
  }
  gap(h = 6) {
    this.y -= h;
  }
}

function stepLine(r: StepResult): string {
  const verdict =
    r.kind === "info"
      ? "information"
      : r.pass === false
        ? "FAIL"
        : r.pass === true
          ? r.value !== null
            ? "pass"
            : "done"
          : "not done";
  const measured = r.measured || (r.value !== null ? formatEng(r.value, r.unit as EngUnit, 6) : "");
  return `${r.id} ${verdict}${measured ? `, measured ${measured}` : ""}: ${r.text}`;
}

export async function fieldRecordPdf(ctx: RecordContext): Promise<Uint8Array> {
  const c = ctx.check;
  const doc = await PDFDocument.create();
  const when = new Date(c.createdAt);
  doc.setTitle(`Field check ${c.id}: ${c.assetTag} r${c.revisionNumber}`);
  doc.setAuthor(c.signedOffBy);
  doc.setSubject(`${c.retrofitName}, ${ctx.site}`);
  doc.setProducer("Clockgraft");
  doc.setCreator("Clockgraft");
  doc.setCreationDate(when);
  doc.setModificationDate(when);
  const w = new Writer(
    doc,
    await doc.embedFont(StandardFonts.Helvetica),
    await doc.embedFont(StandardFonts.HelveticaBold),
  );

  w.text(`Field check record #${c.id}`, { size: 16, bold: true });
  w.gap();
  w.text(`Retrofit: ${c.retrofitName}`);
  w.text(`Site: ${ctx.site} · asset ${c.assetTag}${c.boardRef ? ` · board ${c.boardRef}` : ""}`);
  w.text(`Revision r${c.revisionNumber} · bundle sha256 ${ctx.bundleSha256}`);
  w.text(`Checked: target ${(c.target ?? 0) + 1}, ${ctx.deviceName}`);
  w.text(
    `Result: ${c.passed ? "PASSED, every judged line within its limits" : "FAILED, a line is outside its limits"}`,
    {
      bold: true,
      color: c.passed ? [0, 0.4, 0] : [0.7, 0, 0],
    },
  );
  w.text(
    `Measured period ${c.measuredPeriodS === null ? "-" : formatEng(c.measuredPeriodS, "s", 6)}, high time ${c.measuredHighS === null ? "-" : formatEng(c.measuredHighS, "s", 6)}${c.captureId !== null ? ` (capture #${c.captureId})` : ""}`,
  );

  if (ctx.cautions.length) {
    w.gap();
    w.text("Safety", { size: 12, bold: true });
    for (const line of ctx.cautions) w.text(`- ${line}`, { indent: 8 });
  }

  w.gap();
  w.text("Judged lines", { size: 12, bold: true });
  for (const l of c.lines) {
    const f = (x: number) =>
      l.unit === "" ? `${Number((x * 100).toPrecision(5))} %` : formatEng(x, l.unit, 6);
    const verdict = l.derived ? "information" : l.pass ? "pass" : "FAIL";
    w.text(
      `${l.label}: ${verdict}, measured ${f(l.measured)}, limits ${f(l.min)} .. ${f(l.max)}${l.source ? ` (${l.source})` : ""}`,
      {
        indent: 8,
      },
    );
  }

  if (c.steps.length) {
    w.gap();
    w.text("Checklist lines", { size: 12, bold: true });
    let section = "";
    for (const r of c.steps) {
      if (r.section !== section) {
        section = r.section;
        w.text(section, { bold: true, indent: 4 });
      }
      w.text(stepLine(r), { indent: 8 });
      if (r.note) w.text(`Note: ${r.note}`, { indent: 20, size: 9 });
      const photo = r.photoId !== undefined ? ctx.photos.get(r.photoId) : undefined;
      if (photo) {
        const img =
          photo.mediaType === "image/png"
            ? await doc.embedPng(photo.content)
            : await doc.embedJpg(photo.content);
        const scale = Math.min(1, 220 / img.width, 160 / img.height);
        const h = img.height * scale;
        w.need(h + 6);
        w.page.drawImage(img, { x: MARGIN + 20, y: w.y - h, width: img.width * scale, height: h });
        w.y -= h + 6;
      }
    }
  }

  if (c.notes) {
    w.gap();
    w.text("Notes", { size: 12, bold: true });
    w.text(c.notes, { indent: 8 });
  }
  w.gap(12);
  w.text(
    `Signed off by ${c.signedOffBy}${c.technician.name !== c.signedOffBy ? ` (recorded by ${c.technician.name})` : ""}`,
    {
      bold: true,
    },
  );
  w.text(`Recorded ${c.createdAt.slice(0, 16).replace("T", " ")} UTC`);
  return doc.save({ useObjectStreams: false });
}
