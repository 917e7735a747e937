import type { Test } from 'supertest';

/** Reads any response body as raw bytes (supertest only buffers some types by itself). */
export function asBytes(req: Test): Test {
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}
