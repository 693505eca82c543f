/** The element id of a file's section on the compare page, used by the file index. */
export const fileAnchor = (path: string) => `file-${path.replace(/[^A-Za-z0-9_-]/g, "-")}`;
