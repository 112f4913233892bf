// A report's header (filled once per machine: site, machine, assessed by, date, notes) and its
// cautions, as printed lines and as the first rows of a CSV file. CSV files start with a UTF-8
// byte-order mark, so common spreadsheets read accents and symbols (°, ±, µ) as written.
import { csv, type CsvValue } from '../core';
import type { MachineHeader } from '../state/model';

/** The UTF-8 byte-order mark (U+FEFF) that tells spreadsheets the file is UTF-8. */
export const BYTE_ORDER_MARK = '\uFEFF';

/** The header's lines as label and value, blanks shown as "—" on paper and left empty in a CSV. */
export function headerLines(h: MachineHeader, printedOn: Date): Array<[string, string]> {
  return [
    ['Site', h.site.trim()],
    ['Machine', h.name.trim()],
    ['Assessed by', h.assessedBy.trim()],
    ['Date', h.assessedOn || printedOn.toISOString().slice(0, 10)],
    ['Notes', h.notes.trim()],
  ];
}

/**
 * A whole CSV file: the byte-order mark, the title, the header, the cautions, a blank line, then
 * the tool's own table (RFC 4180 text from the core's csv helpers).
 * @example reportCsv('Lighting check', header, ['Caution.'], 'a,b\r\n', date).startsWith('\uFEFFReport,Lighting check\r\n') // true
 */
export function reportCsv(
  title: string,
  header: MachineHeader,
  cautions: readonly string[],
  table: string,
  printedOn: Date,
): string {
  const rows: CsvValue[][] = [
    ['Report', title],
    ...headerLines(header, printedOn),
    ...cautions.map((line) => ['Caution', line]),
  ];
  return `${BYTE_ORDER_MARK}${csv(rows)}\r\n${table}`;
}

/** "yes" or "no" for a table cell: words, never true/false. */
export function yesNo(value: boolean): string {
  return value ? 'yes' : 'no';
}

/**
 * When a report was printed, in the device's local time: "2026-12-02 15:48". Written by hand:
 * toLocaleString builds a date formatter, which costs milliseconds on a phone at every render.
 */
export function printedAt(date: Date): string {
  const two = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${two(date.getMonth() + 1)}-${two(date.getDate())} ${two(date.getHours())}:${two(date.getMinutes())}`;
}
