import { describe, expect, it } from 'vitest';
import { csv, csvField, csvTable } from '../../../src/core/basics/csv';
import { bad, expectInputError } from '../expectInputError';

describe('csv: RFC 4180 text', () => {
  it('separates fields by commas and ends every record with CRLF', () => {
    // RFC 4180 §2.1–2.2 example: aaa,bbb,ccc CRLF zzz,yyy,xxx CRLF.
    expect(
      csv([
        ['aaa', 'bbb', 'ccc'],
        ['zzz', 'yyy', 'xxx'],
      ]),
    ).toBe('aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
  });

  it('encloses fields with a line break, a comma or a double quote, doubling inner quotes', () => {
    // RFC 4180 §2.6 example "aaa","b CRLF bb","ccc" and §2.7 example "aaa","b""bb","ccc"; only the
    // fields that need it are enclosed here, which §2.5 allows.
    expect(csv([['aaa', 'b\r\nbb', 'ccc']])).toBe('aaa,"b\r\nbb",ccc\r\n');
    expect(csv([['aaa', 'b"bb', 'ccc']])).toBe('aaa,"b""bb",ccc\r\n');
    expect(csv([['1,770 rpm', 'fan']])).toBe('"1,770 rpm",fan\r\n');
    expect(csv([['line\nbreak']])).toBe('"line\nbreak"\r\n');
  });

  it('pads short rows so every record has the same number of fields', () => {
    // RFC 4180 §2.4: each line should contain the same number of fields.
    expect(csv([['a', 'b', 'c'], ['d']])).toBe('a,b,c\r\nd,,\r\n');
  });

  it('writes nothing for an empty table', () => {
    expect(csv([])).toBe('');
  });
});

describe('csvField: spreadsheet formula injection', () => {
  it('puts a single quote before text starting with = + - @, tab or carriage return', () => {
    // OWASP "CSV Injection" (and OWASP ASVS 5.0 requirement 1.2.10, which adds NUL).
    expect(csvField('=1+2')).toBe("'=1+2");
    expect(csvField('+1 555')).toBe("'+1 555");
    expect(csvField('-2 rpm')).toBe("'-2 rpm");
    expect(csvField('@SUM(A1:A9)')).toBe("'@SUM(A1:A9)");
    expect(csvField('\tx')).toBe("'\tx");
    expect(csvField('\0x')).toBe("'\0x");
    expect(csvField('\rx')).toBe('"\'\rx"'); // guarded, then enclosed because it holds a CR
  });

  it('guards first, then quotes: a formula with a comma and a quote stays one harmless field', () => {
    expect(csvField('=1+2";=1+2')).toBe('"\'=1+2"";=1+2"');
    expect(csvField('=HYPERLINK("x","y")')).toBe('"\'=HYPERLINK(""x"",""y"")"');
  });

  it('leaves ordinary text alone, including a quote or equals sign later in the text', () => {
    expect(csvField('Fan 1')).toBe('Fan 1');
    expect(csvField('a=b')).toBe('a=b');
    expect(csvField("it's")).toBe("it's");
    expect(csvField('')).toBe('');
  });

  it('writes numbers as numbers, negative ones unguarded, and −0 as 0', () => {
    expect(csvField(-3.5)).toBe('-3.5');
    expect(csvField(1770)).toBe('1770');
    expect(csvField(-0)).toBe('0');
    expect(csvField(24000 / 1001)).toBe('23.976023976023978');
  });

  it('writes booleans as words and missing values as empty fields', () => {
    expect(csv([[true, false, null, undefined, 'x']])).toBe('true,false,,,x\r\n');
  });

  it('refuses NaN and infinities rather than write them', () => {
    expectInputError(() => csvField(NaN), 'table', 'NaN');
    expectInputError(() => csvField(Infinity), 'table', 'Infinity');
    expectInputError(() => csvField(bad({})), 'table', 'object');
  });
});

describe('csvTable: records under headings', () => {
  it('writes a heading row and one row per record (doc example)', () => {
    expect(
      csvTable([{ label: 'rpm', value: (r: { rpm: number }) => r.rpm }], [{ rpm: 1770 }]),
    ).toBe('rpm\r\n1770\r\n');
  });

  it('guards headings and values alike', () => {
    const table = csvTable(
      [
        { label: 'part', value: (r: { name: string; rpm: number }) => r.name },
        { label: '=speed', value: (r) => r.rpm },
      ],
      [{ name: '@fan', rpm: -1770 }],
    );
    expect(table).toBe("part,'=speed\r\n'@fan,-1770\r\n");
  });

  it('rejects no columns, a column without a heading or reader, and records that are not a list', () => {
    expectInputError(() => csvTable([], []), 'columns', 'column');
    expectInputError(() => csvTable([bad({ label: 'x' })], []), 'columns', 'column 1');
    expectInputError(
      () => csvTable([{ label: 'x', value: () => 1 }], bad('rows')),
      'table',
      'list',
    );
  });
});

describe('csv: bad input', () => {
  it('rejects a table that is not a list of lists', () => {
    expectInputError(() => csv(bad('a,b')), 'table', 'list of rows');
    expectInputError(() => csv(bad([['a'], 'b'])), 'table', 'row 2');
  });
});
