/**
 * A view's table as data: each column carries its key, heading, unit and alignment, and the one function
 * that makes its cell from a row. The text table, the page's HTML table and the drawn sheet render the
 * same columns, so a heading, a rounding or an alignment is written once.
 */
export interface ViewColumn<R> {
  /** stable key (the JSON field or CSV column it stands for, where there is one) */
  readonly key: string;
  readonly heading: string;
  /** the unit of the cells, shown beside the heading where the view has room; null for words and ratios */
  readonly unit: string | null;
  readonly align: 'left' | 'right';
  readonly cell: (row: R) => string;
}

/** The columns' cells for each row. */
export const tableCells = <R>(columns: readonly ViewColumn<R>[], rows: Iterable<R>): string[][] => Array.from(rows, (r) => columns.map((c) => c.cell(r)));

/** A plain-text table: the heading line, a rule of dashes, one line per row; columns two spaces apart, padded to their alignment. */
export function textTable<R>(columns: readonly ViewColumn<R>[], rows: Iterable<R>): string[] {
  const cells = tableCells(columns, rows);
  const headings = columns.map((c) => c.heading);
  const w = headings.map((h, i) => Math.max(h.length, ...cells.map((c) => c[i]!.length)));
  const line = (c: readonly string[]) => c.map((x, i) => (columns[i]!.align === 'left' ? x.padEnd(w[i]!) : x.padStart(w[i]!))).join('  ').trimEnd();
  return [line(headings), line(w.map((n) => '-'.repeat(n))), ...cells.map(line)];
}
