import type { BundleFile } from "./types";

/** The text of a source or document file; images are bytes and have none. */
export function textOf(file: Pick<BundleFile, "path" | "content">): string {
  if (typeof file.content !== "string") throw new Error(`${file.path} is a binary image, not text`);
  return file.content;
}

export const isTextFile = (file: BundleFile): file is BundleFile & { content: string } =>
  typeof file.content === "string";
