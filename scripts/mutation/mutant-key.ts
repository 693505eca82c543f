/** One mutant's name across runs: file, 0-based start line and column, mutator, replacement. */
export function mutantKey(
  file: string,
  mutator: string,
  replacement: string | undefined,
  start: { line: number; column: number },
): string {
  return `${file}:${start.line}:${start.column}:${mutator}:${replacement ?? ""}`;
}
