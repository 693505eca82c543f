// File names in Content-Disposition, both ways.
//
// Answers (downloads) follow RFC 6266 section 4.3: `filename="..."` carries an
// ASCII fallback as a quoted-string (RFC 9110 section 5.6.4: `"` and `\` are
// escaped with a backslash), and `filename*=UTF-8''...` the whole name in the
// RFC 8187 (formerly RFC 5987) extended notation, which a current browser
// prefers. Nothing of the name is cut off; characters that cannot sit in a
// header at all (controls) become "_" in both.
//
// Requests (multipart/form-data uploads, RFC 7578 section 4.2) carry the name
// as a quoted-string. Browsers follow the HTML standard's form encoding and
// write `"` as %22, CR as %0D and LF as %0A; curl and other clients escape
// with a backslash; some send `filename*`. All three are read, so a name
// with quotes arrives whole instead of ending at the first quote.

/** attr-char of RFC 8187 section 3.2.1: what may appear unescaped in an ext-value. */
const ATTR_CHAR = /[A-Za-z0-9!#$&+\-.^_`|~]/;

function encodeExtValue(s: string): string {
  let out = "";
  for (const byte of new TextEncoder().encode(s)) {
    const c = String.fromCharCode(byte);
    out += byte < 0x80 && ATTR_CHAR.test(c) ? c : `%${byte.toString(16).toUpperCase().padStart(2, "0")}`;
  }
  return out;
}

/** The name with header-breaking characters (C0 controls, DEL) replaced. */
function headerSafe(name: string): string {
  return name.replace(/[\u0000-\u001f\u007f]/g, "_");
}

/** An ASCII stand-in: non-ASCII letters become "_", quotes and backslashes are escaped. */
function asciiFallback(name: string): string {
  return name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, (c) => `\\${c}`);
}

/** `attachment; filename="..."; filename*=UTF-8''...` for a download of `name`. */
export function contentDisposition(name: string, type: "attachment" | "inline" = "attachment"): string {
  const safe = headerSafe(name);
  const fallback = asciiFallback(safe);
  const plain = /^[\x20-\x7e]*$/.test(safe);
  // The extended form is added whenever the fallback differs from the name.
  return plain && !/["\\%]/.test(safe)
    ? `${type}; filename="${fallback}"`
    : `${type}; filename="${fallback}"; filename*=UTF-8''${encodeExtValue(safe)}`;
}

/** Parameters of a Content-Disposition value (names lower-cased); quoted-strings unescaped. */
export function dispositionParams(value: string): Record<string, string> {
  const out: Record<string, string> = {};
  // After the disposition type: ; name=token | ; name="quoted \" string"
  const param = /;\s*([^\s=;]+)\s*=\s*(?:"((?:[^"\\]|\\.)*)"|([^;]*))/g;
  for (let m = param.exec(value); m; m = param.exec(value)) {
    const key = m[1].toLowerCase();
    if (key in out) continue;
    out[key] = m[2] !== undefined ? m[2].replace(/\\(.)/g, "$1") : m[3].trim();
  }
  return out;
}

/** An RFC 8187 ext-value (charset'lang'pct-encoded), or null when it does not decode. */
function decodeExtValue(v: string): string | null {
  const m = /^([A-Za-z0-9!#$%&+\-^_`{}~]+)'[^']*'(.*)$/.exec(v);
  if (!m) return null;
  const charset = m[1].toLowerCase();
  if (charset !== "utf-8" && charset !== "iso-8859-1") return null;
  try {
    if (charset === "utf-8") return decodeURIComponent(m[2]);
    return m[2].replace(/%([0-9A-Fa-f]{2})/g, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
  } catch {
    return null;
  }
}

/** The file name a multipart part's Content-Disposition carries, or null. */
export function uploadFileName(disposition: string): string | null {
  const p = dispositionParams(disposition);
  const ext = p["filename*"] !== undefined ? decodeExtValue(p["filename*"]) : null;
  if (ext !== null) return ext;
  if (p.filename === undefined) return null;
  // The HTML standard's form encoding: only these three are escaped.
  return p.filename.replace(/%22/g, '"').replace(/%0D/gi, "\r").replace(/%0A/gi, "\n");
}
