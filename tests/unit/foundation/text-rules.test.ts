import { describe, it, expect } from 'vitest';
import { line, name, paragraph } from '../../../shared/schemas/text.js';
import { isoDate, isoMoment } from '../../../shared/schemas/common.js';

const first = (schema: { safeParse: (v: unknown) => any }, v: unknown) => schema.safeParse(v).error?.issues[0]?.message ?? null;

describe('the shared text rules', () => {
  it('when a name is written with a direction mark between scripts (U+200E/U+200F), then it is accepted: marks reorder no letter', () => {
    expect(name().safeParse('Dana \u200fדנה\u200e (LEJ)').success).toBe(true);
  });

  it('when text carries C1 controls, DEL or a paragraph separator, then it is refused in plain words', () => {
    expect(first(line(), 'a\u0085b')).toBe('must not contain control characters');
    expect(first(line(), 'a\u007fb')).toBe('must not contain control characters');
    expect(first(line(), 'a\u2029b')).toBe('must be on one line');
  });

  it('when multi-line text has CRLF line ends and tabs, then it is kept with LF; a lone carriage return is refused', () => {
    expect(paragraph().parse(' first\r\n\tsecond ')).toBe('first\n\tsecond');
    expect(first(paragraph(), 'a\rb')).toBe('must not contain control characters');
  });

  it('when text is only a zero-width joiner, a BOM or combining marks, then it must contain something visible', () => {
    for (const v of ['\u200d', '\ufeff\u200b', '\u0301\u0301']) expect(first(line(), v)).toBe('must contain something visible');
  });

  it('when a date or a moment is out of 1900–2199 or not on the calendar, then the message says the span', () => {
    for (const v of ['2024-02-30', '2023-02-29', '1899-12-31', '2200-01-01']) expect(first(isoDate, v)).toBe('must be a real date between 1900 and 2199');
    expect(isoDate.safeParse('2024-02-29').success).toBe(true);
    expect(first(isoMoment, '0000-01-01T00:00:00Z')).toBe('must be a real date between 1900 and 2199');
    expect(isoMoment.safeParse('2199-12-31T23:59:59-05:00').success).toBe(true);
  });
});
