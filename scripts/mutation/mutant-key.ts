type Position = { line: number; column: number };
/** Where a mutant sits: its first and last position. */
export type MutantLocation = { start: Position; end: Position };

/**
 * One mutant's name across runs: file, 0-based start and end (line and
 * column), mutator, replacement. The end is part of the name: nested nodes
 * (`a && b` inside `a && b && c`) start at the same column and can take the
 * same mutator and replacement.
 */
export function mutantKey(
  file: string,
  mutator: string,
  replacement: string | undefined,
  location: MutantLocation,
): string {
  const { start, end } = location;
  return `${file}:${start.line}:${start.column}-${end.line}:${end.column}:${mutator}:${replacement ?? ""}`;
}

/** Stryker's report positions are 1-based; the instrumenter's are 0-based. */
export function fromReportLocation(location: MutantLocation): MutantLocation {
  const less = (p: Position) => ({ line: p.line - 1, column: p.column - 1 });
  return { start: less(location.start), end: less(location.end) };
}
