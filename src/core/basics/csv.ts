import { InputError } from './InputError';

/** What a CSV cell may hold. null and undefined write an empty field. */
export type CsvValue = string | number | boolean | null | undefined;

/** A column of a table written from records: its heading and how to read it from a row. */
export interface CsvColumn<T> {
  label: string;
  value: (row: T) => CsvValue;
}

/**
 * Characters that make a spreadsheet read a cell as a formula when they come first
 * (OWASP "CSV Injection": = + - @, tab, carriage return; OWASP ASVS 5.0 requirement 1.2.10 adds NUL).
 */
const FORMULA_START = /^[=+\-@\t\r\0]/;
/** RFC 4180 §2.6: fields holding a comma, a double quote or a line break are enclosed in double quotes. */
const NEEDS_QUOTES = /[",\r\n]/;

/**
 * One CSV field. Text is guarded against spreadsheet formula injection by a leading single
 * quote when it starts with = + - @, tab, carriage return or NUL (OWASP "CSV Injection"), then
 * quoted per RFC 4180 §2.6–2.7 (enclosed in double quotes, inner quotes doubled) when it holds
 * a comma, a double quote, CR or LF. Numbers are written as numbers (a numeric literal such as
 * -3.5 cannot run as a formula, and a quote would turn it into text); -0 is written as 0.
 * Throws InputError for a number that is NaN or infinite, or a value of another type.
 * @example csvField('=1+2') // "'=1+2"
 * @example csvField('b"bb') // '"b""bb"'
 */
export function csvField(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      throw new InputError(
        'table',
        `A table cell holds ${String(value)}, which cannot be written; this is a bug to report.`,
      );
    }
    return Object.is(value, -0) ? '0' : String(value);
  }
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (typeof value !== 'string')
    throw new InputError(
      'table',
      `A table cell holds a ${typeof value}; only text and numbers can be written.`,
    );
  const guarded = FORMULA_START.test(value) ? `'${value}` : value;
  return NEEDS_QUOTES.test(guarded) ? `"${guarded.replace(/"/g, '""')}"` : guarded;
}

/**
 * RFC 4180 CSV text from rows of cells: fields separated by commas, every record (the last
 * too) ended by CRLF, fields escaped by csvField. Rows may differ in length; RFC 4180 asks for
 * the same count, so short rows are padded with empty fields to the longest.
 * Throws InputError when rows is not a list of lists, or for a cell csvField refuses.
 * @example csv([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]) // 'aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n' (RFC 4180 §2.1–2.2)
 * Source: RFC 4180 "Common Format and MIME Type for CSV Files" §2.
 */
export function csv(rows: CsvValue[][]): string {
  if (!Array.isArray(rows))
    throw new InputError('table', 'The table to write must be a list of rows.');
  const width = rows.reduce((w, row, i) => {
    if (!Array.isArray(row))
      throw new InputError('table', `Row ${i + 1} of the table is not a list of cells.`);
    return Math.max(w, row.length);
  }, 0);
  return rows
    .map((row) => {
      const cells = row.map(csvField);
      while (cells.length < width) cells.push('');
      return cells.join(',') + '\r\n';
    })
    .join('');
}

/**
 * CSV of records with a heading row: one column per CsvColumn, in order.
 * Throws InputError for no columns, a column without a label or reader, or a cell csvField refuses.
 * @example csvTable([{ label: 'rpm', value: (r: { rpm: number }) => r.rpm }], [{ rpm: 1770 }]) // 'rpm\r\n1770\r\n'
 */
export function csvTable<T>(columns: CsvColumn<T>[], records: T[]): string {
  if (!Array.isArray(columns) || columns.length === 0)
    throw new InputError('columns', 'Give at least one column to write.');
  if (!Array.isArray(records))
    throw new InputError('table', 'The records to write must be a list.');
  columns.forEach((c, i) => {
    if (typeof c?.label !== 'string' || typeof c.value !== 'function') {
      throw new InputError(
        'columns',
        `Column ${i + 1} needs a heading and a way to read its value.`,
      );
    }
  });
  return csv([columns.map((c) => c.label), ...records.map((r) => columns.map((c) => c.value(r)))]);
}
