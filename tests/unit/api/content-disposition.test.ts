// File names in Content-Disposition (issue 15 point 8: upload names were cut
// at a quote; downloads wrote names into a quoted-string unescaped).
// Downloads: RFC 6266 section 4.3 (filename plus filename*), ext-values of
// RFC 8187 (formerly RFC 5987). Each header we write is read back by an
// independent parser, the jshttp `content-disposition` package that Next.js
// ships compiled, so the check does not grade our writer with our reader.
// Uploads: the HTML standard's multipart/form-data encoding ("%22" for a
// quote, "%0D"/"%0A" for CR/LF), backslash escapes (curl) and filename*.
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { contentDisposition, dispositionParams, uploadFileName } from "@/lib/api/content-disposition";
import { cleanName } from "@/lib/field/upload";
import { bundleFileName } from "@/lib/revisions/bundle-http";

const require = createRequire(import.meta.url);
const jshttp = require("next/dist/compiled/content-disposition") as {
  parse(header: string): { type: string; parameters: Record<string, string> };
};

const NAMES = [
  "firmware.hex",
  'say "hi".csv',
  "back\\slash.csv",
  "50% duty.csv",
  "Kühlraum Ω 2.csv",
  "ポンプ.zip",
  "emoji 🔧.csv",
  "semi;colon,comma.csv",
  "a'b'c.csv",
];

describe("download headers", () => {
  it.each(NAMES)("%s reads back whole through an independent parser", (name) => {
    const header = contentDisposition(name);
    const parsed = jshttp.parse(header);
    expect(parsed.type).toBe("attachment");
    expect(parsed.parameters.filename).toBe(name);
    // Every header byte is visible ASCII (RFC 9110 field values; no raw UTF-8).
    expect(header).toMatch(/^[\x20-\x7e]*$/);
  });

  it("plain ASCII names keep the short form", () => {
    expect(contentDisposition("clockgraft-T-1-r1.zip")).toBe('attachment; filename="clockgraft-T-1-r1.zip"');
    expect(contentDisposition("r1-r2.diff", "inline")).toBe('inline; filename="r1-r2.diff"');
  });

  it("the fallback for old clients is ASCII with escaped quotes", () => {
    const params = dispositionParams(contentDisposition('Ω "x".csv'));
    expect(params.filename).toBe('_ "x".csv');
    // RFC 8187 section 3.2.1: UTF-8 of Ω is CE A9; '"' is not an attr-char.
    expect(params["filename*"]).toBe("UTF-8''%CE%A9%20%22x%22.csv");
  });

  it("controls cannot break the header", () => {
    const header = contentDisposition("a\r\nSet-Cookie: x=1.csv");
    expect(header).not.toMatch(/[\r\n]/);
    expect(jshttp.parse(header).parameters.filename).toBe("a__Set-Cookie: x=1.csv");
  });

  it("bundle names keep the asset tag, without spaces or folders", () => {
    expect(bundleFileName("PH 2/Ω", 3)).toBe("clockgraft-PH-2-Ω-r3.zip");
    expect(jshttp.parse(contentDisposition(bundleFileName("PH 2/Ω", 3))).parameters.filename).toBe(
      "clockgraft-PH-2-Ω-r3.zip",
    );
  });
});

describe("upload names", () => {
  it("reads the HTML standard's escapes, backslash escapes and filename*", () => {
    expect(uploadFileName('form-data; name="file"; filename="say %22hi%22.csv"')).toBe('say "hi".csv');
    expect(uploadFileName('form-data; name="file"; filename="say \\"hi\\".csv"')).toBe('say "hi".csv');
    // RFC 6266 section 5, example with an ext-value: "€ rates".
    expect(uploadFileName("form-data; name=\"file\"; filename*=UTF-8''%e2%82%ac%20rates")).toBe("€ rates");
    expect(uploadFileName('form-data; name="file"; filename="a;b.csv"')).toBe("a;b.csv");
    expect(uploadFileName('form-data; name="file"')).toBeNull();
    expect(dispositionParams('form-data; name="file"; filename="x.csv"').name).toBe("file");
  });

  it("planted fault: the old reader cut the name at the first quote", () => {
    const header = 'form-data; name="file"; filename="say \\"hi\\".csv"';
    const old = /\bfilename="([^"]*)"/i.exec(header)?.[1];
    expect(old).toBe("say \\");
    expect(uploadFileName(header)).not.toBe(old);
  });

  it("stored names drop folders, breaks and bidi controls and keep quotes", () => {
    expect(cleanName('C:\\scope\\say "hi".csv')).toBe('say "hi".csv');
    expect(cleanName("trace\u202Evsc.exe")).toBe("tracevsc.exe");
    expect(cleanName("a%0Ab".replace("%0A", "\n"))).toBe("a b");
    expect(cleanName("")).toBe("capture.csv");
  });
});
