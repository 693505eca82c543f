// Plain text people type: names, notes, comments. Two kinds of character are
// refused, each with a message on its field:
//  - line breaks (CR, LF, NEL, U+2028, U+2029) in single-line text (a name, a
//    site, a signature): a name that breaks a line can forge a second line in
//    a mail, a checklist or the audit log;
//  - the Unicode bidirectional embedding, override and isolate controls
//    (U+202A..U+202E, U+2066..U+2069; Unicode Standard Annex #9, "Explicit
//    Directional Formatting Characters") in any text: they make text display
//    in another order than it is stored ("Trojan Source"), so what a reviewer
//    reads is not what was written.
// Text arriving from headers (an uploaded file's name) cannot be sent back to
// its author, so cleanLine removes these characters instead.
// The schemas are built with "zod/mini" (they reach the browser through the
// workspace forms); server schemas wrap them with z.optional(), z._default().
import * as z from "zod/mini";

/** U+202A-U+202E (embeddings, overrides, pop) and U+2066-U+2069 (isolates). */
export const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069]/u;
/** CR, LF, NEL (U+0085), LINE SEPARATOR (U+2028), PARAGRAPH SEPARATOR (U+2029). */
export const LINE_BREAKS = /[\r\n\u0085\u2028\u2029]/u;

const hex = (c: string) => `U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")}`;

/** Why this text cannot be stored as it is, or null. */
export function plainTextProblem(text: string, label: string, opts: { singleLine: boolean }): string | null {
  const bidi = BIDI_CONTROLS.exec(text);
  if (bidi)
    return `${label} contains a bidirectional control character (${hex(bidi[0])}), which can make text read in another order than it is stored; remove it.`;
  if (opts.singleLine && LINE_BREAKS.test(text)) return `${label} must be on one line (no line breaks).`;
  return null;
}

function checked(label: string, opts: { min?: number; max: number; singleLine: boolean }) {
  return z.string({ error: `${label} is text.` }).check(
    z.trim(),
    ...(opts.min ? [z.minLength(opts.min, `${label} is required.`)] : []),
    z.maxLength(opts.max, `${label} is at most ${opts.max} characters.`),
    z.superRefine((v: string, ctx) => {
      const problem = plainTextProblem(v, label, { singleLine: opts.singleLine });
      if (problem) ctx.addIssue({ code: "custom", message: problem });
    }),
  );
}

/** One line of text (a name, a site, a signature): trimmed, no line breaks, no bidi controls. */
export function lineText(label: string, opts: { min?: number; max: number }) {
  return checked(label, { ...opts, singleLine: true });
}

/** Text that may span lines (a description, a note, a comment): trimmed, no bidi controls. */
export function paragraphText(label: string, opts: { min?: number; max: number }) {
  return checked(label, { ...opts, singleLine: false });
}

/** A single line with line breaks turned into spaces and bidi controls removed (names from headers). */
export function cleanLine(text: string): string {
  return text
    .replace(new RegExp(BIDI_CONTROLS.source, "gu"), "")
    .replace(new RegExp(LINE_BREAKS.source, "gu"), " ")
    .trim();
}
