import fc from 'fast-check';

/** Hostile leaves: text that breaks encodings and renderers, numbers at the edges, wrong types, odd dates and ids. */
export const HOSTILE_STRINGS = [
  '\u0000', 'a\u0000b', '\ud800', 'x\udc00y', '\u202eevil\u202c', '\u2066x\u2069', '\u200b\u200b', '\u3164', '', ' ', '\t\n\r',
  '\u0085\u009b', 'NaN', 'Infinity', '-Infinity', '1e308', '-0', '0x1F', '١٢٣', '__proto__', 'constructor', '{}', '[]', 'null',
  'true', "'; drop table users; --", '%00', '../../etc/passwd', '=1+1', '\ufeff', '\uffff', '😀'.repeat(50), 'e\u0301'.repeat(40),
  '2026-02-30', '2026-13-01', '0000-01-01', '9999-12-31', '2026-03-05T25:00:00Z', '0000-01-01T00:00:00Z', '+275760-09-13T00:00:00Z',
  '2026-03-05T14:30:00', '00000000-0000-0000-0000-000000000000', 'FFFFFFFF-FFFF-FFFF-FFFF-FFFFFFFFFFFF', '{00000000-0000-4000-8000-000000000000}',
  'urn:uuid:00000000-0000-4000-8000-000000000000', '000000000000400080000000000000000',
];
/** The nastiest text, for fields that take text: what breaks storage, rendering or a spreadsheet. */
export const HOSTILE_TEXT = ['\u0000', 'a\u0000b', '\ud800', 'x\udc00y', '\u202eevil', '\u2066x\u2069', '\u200b\u200b', '\u3164', '=1+1', '\u0085', 'e\u0301', 'x'.repeat(2001), '\uffff'];
export const HOSTILE_NUMBERS = [1e308, -1e308, -0, 0, 5e-324, 2 ** 53 + 1, -1, 0.5, 1e21, -2147483649, 2147483648];

const deep = (n: number): unknown => (n ? { a: deep(n - 1) } : 'x');
const huge = fc.constantFrom('a'.repeat(200_000), '\u0000'.repeat(5_000), 'é'.repeat(140_000), 'x'.repeat(2_001));

/** Any hostile value, of any type. */
export const hostile: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(...HOSTILE_STRINGS) },
  { weight: 3, arbitrary: fc.constantFrom(...HOSTILE_NUMBERS) },
  { weight: 1, arbitrary: huge },
  { weight: 3, arbitrary: fc.constantFrom<unknown>(null, true, false, [], {}, [{}], [[]], ['a', 1, null], { __proto__: null, constructor: { prototype: { admin: true } } }) },
  { weight: 1, arbitrary: fc.constantFrom(deep(40), Array.from({ length: 2000 }, (_, i) => `item ${i}`)) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
);

/** Some hostile bodies that are not objects, or not JSON at all: [content type, raw text]. */
export const HOSTILE_RAW: [string, string][] = [
  ['application/json', '{"a":'], ['application/json', 'null'], ['application/json', '"text"'], ['application/json', '[1,2]'],
  ['application/json', '{"a":"\\ud800"}'], ['application/json', '{"__proto__":{"x":1}}'], ['application/json; charset=utf-16', '{}'],
  ['text/plain', 'hello'], ['application/x-www-form-urlencoded', 'a=1&a=2&b[c]=3'], ['application/json', '\u0000'],
];

const LONE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g;
/** Percent-encodes like encodeURIComponent, writing a lone surrogate as its (invalid) UTF-8 bytes instead of throwing. */
export const enc = (s: string) => s.split(LONE).map(encodeURIComponent).join('%ED%A0%80');

/** A query string from values: arrays repeat the key, objects are written as key[sub]=…, the rest as text. */
export function queryString(q: Record<string, unknown>): string {
  const parts: string[] = [];
  const put = (k: string, v: unknown) => {
    if (v === undefined) return;
    if (Array.isArray(v)) v.slice(0, 50).forEach((x) => put(k, x));
    else if (v && typeof v === 'object') Object.entries(v).slice(0, 5).forEach(([s, x]) => put(`${k}[${s}]`, typeof x === 'object' ? JSON.stringify(x) : x));
    else parts.push(`${enc(k)}=${enc(String(v as string))}`);
  };
  Object.entries(q).forEach(([k, v]) => put(k, v));
  return parts.join('&');
}

/** Malformed or hostile multipart bodies for upload routes: [content type, body]. */
export function hostileMultipart(field: string): [string, Buffer][] {
  const b = 'fuzzboundary';
  const part = (head: string, body: string) => `--${b}\r\nContent-Disposition: form-data; ${head}\r\n\r\n${body}\r\n`;
  const png = '@@PNG@@';
  const PNG = Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex');
  return ([
    [`multipart/form-data; boundary=${b}`, 'no boundary in here at all'],
    [`multipart/form-data; boundary=${b}`, `--${b}\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n%PDF-1.4 trunc`],
    ['multipart/form-data', part('name="caption"', 'x') + `--${b}--`],
    [`multipart/form-data; boundary=${b}`, part('name="caption"', field) + part('name="file"; filename="a.png"', png) + `--${b}--`],
    [`multipart/form-data; boundary=${b}`, part('name="ownerId"', field) + part('name="file"; filename="a.png"', png) + `--${b}--`],
    [`multipart/form-data; boundary=${b}`, part(`name="file"; filename="${field.slice(0, 300)}.png"`, png) + `--${b}--`],
    [`multipart/form-data; boundary=${b}`, part("name=\"file\"; filename*=UTF-8''%ED%A0%80%E2%80%AE.png", png) + `--${b}--`],
    [`multipart/form-data; boundary=${b}`, part('name="file"; filename="a.png"', png) + part('name="file"; filename="b.png"', png) + `--${b}--`],
    [`multipart/form-data; boundary=${b}`, part(`name="${field.slice(0, 200)}"`, 'x') + `--${b}--`],
  ] as [string, string][]).map(([type, body]) => [type, Buffer.concat(body.split(png).flatMap((x, i) => (i ? [PNG, Buffer.from(x)] : [Buffer.from(x)])))]);
}
