import { describe, expect, test } from 'vitest';
import { headerLines, printedAt } from '../../src/words/report';

describe('the printed report', () => {
  test('says when it was printed in local time, year first, minutes padded', () => {
    // new Date(year, monthIndex, …) is local time: what the page's clock shows.
    expect(printedAt(new Date(2026, 11, 2, 15, 8))).toBe('2026-12-02 15:08');
    expect(printedAt(new Date(2027, 0, 9, 7, 45))).toBe('2027-01-09 07:45');
  });

  test('dates the header by the day it was assessed, else by the day printed (ISO 8601)', () => {
    const printed = new Date(Date.UTC(2026, 11, 2, 12));
    const header = { name: 'Cooler fan', site: '', assessedBy: '', assessedOn: '', notes: '' };
    expect(headerLines(header, printed)).toContainEqual(['Date', '2026-12-02']);
    expect(headerLines({ ...header, assessedOn: '2026-11-30' }, printed)).toContainEqual([
      'Date',
      '2026-11-30',
    ]);
  });
});
