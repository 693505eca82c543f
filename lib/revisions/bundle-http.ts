// HTTP details of the bundle download (RFC 9110 sections 8.8.3 and 13.1.2).

/** True when If-None-Match lists this sha256 as a (strong or weak) tag, or is "*". */
export function etagMatches(header: string | null, sha256: string): boolean {
  if (!header) return false;
  return header.split(",").some((raw) => {
    const tag = raw.trim();
    return tag === "*" || tag.replace(/^W\//, "") === `"${sha256}"`;
  });
}

/**
 * The bundle's file name: the asset tag whole, except for spaces, folder
 * separators and controls (each run becomes "-"). contentDisposition
 * (lib/api/content-disposition.ts) adds an ASCII fallback when it needs one.
 */
export function bundleFileName(assetTag: string, number: number): string {
  const base = assetTag.replace(/[\s\u0000-\u001f\u007f/\\]+/g, "-").replace(/^-+|-+$/g, "") || "retrofit";
  return `clockgraft-${base}-r${number}.zip`;
}
