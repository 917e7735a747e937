import { describe, it, expect } from 'vitest';
import { nameProblem, safeFileName, sniff } from '../../../server/evidence/evidence.sniff.js';
import { HTML_PAGE, INSTRUMENT_CSV, makePdf, makePng } from '../../fixtures/evidence-files.js';

// Signature bytes from the format specifications: JPEG SOI (FF D8) then a marker (FF E0 = APP0, "JFIF").
const JFIF_START = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01]);

describe('sniff', () => {
  it('when the bytes start with a format signature, then that type is detected whatever else follows', async () => {
    expect(sniff(makePng())).toEqual({ mediaType: 'image/png' });
    expect(sniff(JFIF_START)).toEqual({ mediaType: 'image/jpeg' });
    expect(sniff(await makePdf())).toEqual({ mediaType: 'application/pdf' });
  });

  it('when the PNG signature is not followed by an IHDR chunk, then it is not taken for a PNG', () => {
    const fake = Buffer.concat([makePng().subarray(0, 8), Buffer.from('<html>not an image</html>')]);
    expect(sniff(fake).mediaType).toBeUndefined();
  });

  it('when text parses into rows of two or more columns, then it is a CSV; markup, prose and binary are not', () => {
    expect(sniff(INSTRUMENT_CSV)).toEqual({ mediaType: 'text/csv' });
    expect(sniff(Buffer.from('\uFEFFa,b\r\n1,2\r\n'))).toEqual({ mediaType: 'text/csv' });
    expect(sniff(Buffer.from('a\tb\n1\t2\n'))).toEqual({ mediaType: 'text/csv' });
    expect(sniff(HTML_PAGE).problem).toMatch(/HTML or XML markup/);
    expect(sniff(Buffer.from('just a line of prose\nand another\n')).problem).toMatch(/does not parse/);
    expect(sniff(Buffer.from('a,b\n1,\u0000\n')).problem).toMatch(/not a JPEG or PNG image/);
    expect(sniff(Buffer.from([0xc3, 0x28, 0x2c, 0x61])).problem).toMatch(/not a JPEG or PNG image/); // invalid UTF-8
    expect(sniff(Buffer.alloc(0)).problem).toBe('the file is empty');
  });
});

describe('file names', () => {
  it('when a name carries a path, controls or markup, then only a plain last part is kept', () => {
    expect(safeFileName('C:\\Users\\tom\\scope.png', 'image/png')).toBe('scope.png');
    expect(safeFileName('a\u0000b\u202e.png', 'image/png')).toBe('ab.png');
    expect(safeFileName('"><img src=x>.pdf', 'application/pdf')).toBe('_img src=x_.pdf');
    expect(safeFileName(undefined, 'text/csv')).toBe('evidence.csv');
    expect(safeFileName('Prüfprotokoll Łódź', 'application/pdf')).toBe('Prüfprotokoll Łódź.pdf');
    expect(safeFileName(`${'x'.repeat(300)}.jpeg`, 'image/jpeg')).toHaveLength(120);
  });

  it('when the extension claims another type, then the name is refused; a matching or missing one is fine', () => {
    expect(nameProblem('photo.png', 'text/csv')).toBe('the name ends in .png but the content is a CSV export');
    expect(nameProblem('photo.JPG', 'image/jpeg')).toBeNull();
    expect(nameProblem('export', 'text/csv')).toBeNull();
  });
});
