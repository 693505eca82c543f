// The zip's entries: sorted by path whatever order the files come in, so the same files give the
// same bytes (product.md: the bundle is deterministic); two files at one path are refused, since
// the zip would keep only one of them. Entry order is read back with jszip's own reader, which
// lists entries in central-directory order (APPNOTE.TXT 4.3.12, the central directory).
import JSZip from "jszip";
import { describe, expect, it } from "vitest";
import { sha256Hex, zipBundle } from "@/lib/bundle";

const files = () => [
  { path: "rp2040/src/main.c", content: "int main(void) { return 0; }\n" },
  { path: "README.md", content: "# read me\n" },
  { path: "atmega328p/CHECKLIST.md", content: "- [ ] B1\n" },
  { path: "atmega328p/src/main.c", content: "/* main */\n" },
  { path: "plan.json", content: "{}\n" },
];

describe("bundle zip", () => {
  it("writes the entries sorted by path, whatever order the files come in", async () => {
    const zip = await JSZip.loadAsync(await zipBundle(files()));
    expect(Object.keys(zip.files)).toEqual([
      "README.md",
      "atmega328p/CHECKLIST.md",
      "atmega328p/src/main.c",
      "plan.json",
      "rp2040/src/main.c",
    ]);
    expect(await zip.file("README.md")!.async("string")).toBe("# read me\n");
  });

  it("gives the same bytes for the files in any order", async () => {
    const a = files();
    const reversed = [...a].reverse();
    const rotated = [...a.slice(2), ...a.slice(0, 2)];
    const want = sha256Hex(await zipBundle(a));
    expect(sha256Hex(await zipBundle(reversed))).toBe(want);
    expect(sha256Hex(await zipBundle(rotated))).toBe(want);
  });

  it("refuses two files at one path, naming it", async () => {
    const twice = [...files(), { path: "plan.json", content: '{"second": true}\n' }];
    await expect(zipBundle(twice)).rejects.toThrow("bundle: two files at plan.json");
  });
});
