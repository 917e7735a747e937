import { describe, it, expect } from 'vitest';
import { z } from 'zod';
import { recordId, uuid, uuidParam } from '../../../shared/schemas/common.js';
import { acceptedSpellings, refusedSpellings } from '../../support/id-spellings.js';

const ID = '3f2504e0-4f89-41d3-9a0c-0305e82c3301';
const first = (schema: z.ZodType, value: unknown) => {
  const r = schema.safeParse(value);
  return r.success ? null : r.error.issues[0].message;
};

describe('ids parsed once at the boundary', () => {
  it('when an id comes in any letter case, then one lower-case spelling comes out', () => {
    for (const s of acceptedSpellings(ID)) expect(uuid().parse(s)).toBe(ID);
    expect(uuidParam.parse({ id: ID.toUpperCase() })).toEqual({ id: ID });
    // zod's own pattern takes the max UUID in lower case only; folding the case first takes it in both.
    expect(uuid().parse('FFFFFFFF-FFFF-FFFF-FFFF-FFFFFFFFFFFF')).toBe('ffffffff-ffff-ffff-ffff-ffffffffffff');
  });

  it('when an id is braced, unhyphenated, urn-prefixed or padded (all read by PostgreSQL), then it is refused with the field\'s message', () => {
    for (const s of refusedSpellings(ID)) {
      expect(first(uuid(), s), s).toBe('must be a UUID');
      expect(first(uuid('choose a site'), s), s).toBe('choose a site');
    }
    expect(first(z.object({ siteId: uuid() }), {}), 'a missing id is reported as missing').toBe('is required');
  });

  it('when a record id given as text is a UUID, then it is lower-cased; another record id stays as it is', () => {
    expect(recordId().parse(` ${ID.toUpperCase()} `)).toBe(ID);
    expect(recordId().parse('AUD-17')).toBe('AUD-17');
  });
});
