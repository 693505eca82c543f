// User text (retrofit name, site, asset tag) lands in C comments and Markdown.
// These keep it inert there: a comment cannot be closed early or split, and a
// table cell cannot be broken by a pipe or a newline.

/** One line of text safe inside a C block or line comment. */
export function cCommentText(text: string): string {
  return text
    .replace(/[\r\n\t\v\f\u2028\u2029]+/g, " ")
    .replace(/[\u0000-\u001f\u007f]/g, "")
    .replace(/\*\//g, "* /")
    .replace(/\/\*/g, "/ *")
    .replace(/\\$/g, "\\ ")
    .replace(/\?\?/g, "? ?")
    .trim();
}

/** One line of text safe as Markdown inline content (also in a table cell). */
export function markdownText(text: string): string {
  return text
    .replace(/[\r\n\t\v\f\u2028\u2029]+/g, " ")
    .replace(/[\u0000-\u001f\u007f]/g, "")
    .replace(/([\\`*_{}\[\]<>()#+!|~])/g, "\\$1")
    .replace(/^([-=])/, "\\$1")
    .trim();
}

/** A CSV field per RFC 4180: quoted when it holds a comma, quote or newline. */
export function csvField(value: string | number): string {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
