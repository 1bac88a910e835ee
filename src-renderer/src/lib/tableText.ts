/** A table as text to paste: tab-separated (spreadsheets and e-mail), or CSV per RFC 4180. */
export type Cell = string | number | null;

/** Tab-separated lines with a header row; empty cells for null. */
export function tabSeparated(header: string[], rows: Cell[][]): string {
  return [header, ...rows].map((row) => row.map((cell) => (cell === null ? '' : String(cell))).join('\t')).join('\n') + '\n';
}

/** RFC 4180: CRLF line ends, fields with a comma, quote or line break quoted, quotes doubled. */
export function csv(header: string[], rows: Cell[][]): string {
  const field = (cell: Cell) => {
    const text = cell === null ? '' : String(cell);
    return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
  };
  return [header, ...rows].map((row) => row.map(field).join(',')).join('\r\n') + '\r\n';
}
