/**
 * CSV the product writes (reports, registers, comparisons): RFC 4180 (comma, CRLF, fields with a comma,
 * quote or line break quoted, quotes doubled), UTF-8 with a byte-order mark so spreadsheet programs read the
 * characters right, and text that a spreadsheet would run as a formula neutralised.
 */

export type CsvValue = string | number | boolean | null | undefined;

/** A field starting with one of these is read as a formula by common spreadsheet programs. */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Makes text safe to open in a spreadsheet: a leading `=`, `+`, `-`, `@`, tab or carriage return gets a
 * leading apostrophe, so the cell shows the text instead of running it (the usual CSV-injection defence).
 * Numbers are written as numbers and never changed, so a negative temperature stays a number.
 *
 * @param value - a cell
 * @returns the cell's text
 * @example neutraliseFormula('=HYPERLINK("x")') // "'=HYPERLINK(\"x\")"
 */
export function neutraliseFormula(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return FORMULA_START.test(value) ? `'${value}` : value;
}

function field(value: CsvValue): string {
  const text = neutraliseFormula(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * Rows → CSV text with a UTF-8 byte-order mark, CRLF line ends, header row first.
 *
 * @param header - column names
 * @param rows - cells per row, in header order
 * @returns the CSV text (prefix "\uFEFF")
 * @example toCsv(['tag', 'note'], [['L-1', 'a, b']]) // '\uFEFFtag,note\r\nL-1,"a, b"\r\n'
 */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  const lines = [header.map(field).join(','), ...rows.map((r) => r.map(field).join(','))];
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

/** Sends CSV as a download. */
export function sendCsv(res: { setHeader: (k: string, v: string) => void; send: (body: string) => void }, fileName: string, csv: string): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/[^\w.-]+/g, '_')}"`);
  res.send(csv);
}
