// HTTP details of the bundle download (RFC 9110 sections 8.8.3 and 13.1.2).

/** True when If-None-Match lists this sha256 as a (strong or weak) tag, or is "*". */
export function etagMatches(header: string | null, sha256: string): boolean {
  if (!header) return false;
  return header.split(",").some((raw) => {
    const tag = raw.trim();
    return tag === "*" || tag.replace(/^W\//, "") === `"${sha256}"`;
  });
}

/** A file name safe in a quoted Content-Disposition: ASCII letters, digits, - and _. */
export function bundleFileName(assetTag: string, number: number): string {
  const base = assetTag.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "") || "retrofit";
  return `clockgraft-${base}-r${number}.zip`;
}
