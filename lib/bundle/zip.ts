import JSZip from "jszip";
import type { BundleFile } from "./types";

// A fixed date on every entry and no folder entries (jszip would stamp those
// with the current time): the same files give the same bytes in any time zone.
const FIXED_DATE = new Date(Date.UTC(2000, 0, 1, 0, 0, 0));

export async function zipBundle(files: BundleFile[]): Promise<Uint8Array> {
  const zip = new JSZip();
  // Two files at one path would leave only the last in the zip: a file lost without a word.
  const seen = new Set<string>();
  for (const f of files) {
    if (seen.has(f.path)) throw new Error(`bundle: two files at ${f.path}`);
    seen.add(f.path);
  }
  const sorted = [...files].sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0));
  for (const file of sorted) {
    zip.file(file.path, file.content, {
      date: FIXED_DATE,
      createFolders: false,
      binary: typeof file.content !== "string",
      unixPermissions: 0o644,
    });
  }
  return zip.generateAsync({
    type: "uint8array",
    compression: "DEFLATE",
    compressionOptions: { level: 9 },
    platform: "UNIX",
    streamFiles: false,
  });
}
