import { describe, it, expect } from 'vitest';
import { parse } from 'csv-parse/sync';
import { csvText, safeCell } from '../../../server/csv.js';

// The starts a spreadsheet reads as a formula: =, +, -, @, tab and carriage return (common practice).
describe('CSV cell guard', () => {
  it.each(['=1+1', '+1', '-1', '@SUM(A1)', '\t=1', '\r=1'])('when a text cell starts like %j, then it gets a leading quote', (v) => {
    expect(safeCell(v)).toBe(`'${v}`);
  });

  it('when a cell starts otherwise, then it is left alone, and numbers (negative too) stay numbers', () => {
    expect(safeCell('Tomasz = Wójcik')).toBe('Tomasz = Wójcik');
    expect(safeCell("'=already")).toBe("'=already");
    expect(parse(csvText([['=cmd', -5, 0, 'ok', '']]))).toEqual([["'=cmd", '-5', '0', 'ok', '']]);
  });
});
