import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { seal, smallWrite, verify } from '../support/audit.js';
import { ANCHOR_FILE } from '../../server/audit/anchor.js';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ start: '2026-03-02T09:00:00Z' });
  await verify(t);
});

const lines = () => readFileSync(path.join(t.config.audit.anchorDir, ANCHOR_FILE), 'utf8').trim().split('\n').map((l) => l.split('\t'));
// Quoted-printable soft line breaks undone, so a long seal reads as one word.
const anchorMails = () => t.mails().filter((m) => m.includes('Subject: Audit trail anchor')).map((m) => m.replace(/=\n/g, ''));

describe('anchoring the audit trail outside the database', () => {
  it('when the sealer anchors, then the anchor file gains a keyed line with the head, and each admin gets the day\'s e-mail with it', async () => {
    const run = await seal(t, { anchor: true });
    expect(lines()).toEqual([['2026-03-02T09:00:00.000Z', String(run.head!.id), run.head!.hmac, expect.stringMatching(/^[0-9a-f]{64}$/)]]);
    const mails = anchorMails();
    expect(mails).toHaveLength(1);
    expect(mails[0]).toContain('To: admin@demo.breakover.test');
    expect(mails[0]).toContain('Audit trail anchor for 2026-03-02');
    expect(mails[0]).toContain(`entry #${run.head!.id}`);
    expect(mails[0]).toContain(run.head!.hmac);
  });

  it('when it anchors again the same day, then a moved head adds a line, an unmoved one does not, and no second e-mail goes', async () => {
    await seal(t, { anchor: true });
    expect(lines()).toHaveLength(1);
    t.clock.set('2026-03-02T15:00:00Z');
    await smallWrite(t, 'later');
    const run = await seal(t, { anchor: true });
    expect(lines()).toHaveLength(2);
    expect(lines()[1].slice(0, 3)).toEqual(['2026-03-02T15:00:00.000Z', String(run.head!.id), run.head!.hmac]);
    expect(anchorMails()).toHaveLength(1);
  });

  it('when a new day starts, then the admins get that day\'s e-mail even if the head has not moved', async () => {
    t.clock.set('2026-03-03T00:10:00Z');
    await seal(t, { anchor: true });
    expect(lines()).toHaveLength(2);
    expect(anchorMails().map((m) => /Audit trail anchor for (\S+)/.exec(m)?.[1])).toEqual(['2026-03-02', '2026-03-03']);
    expect(await verify(t)).toMatchObject({ intact: true, anchors: 2 });
  });
});
