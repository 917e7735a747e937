import type { TestApp } from './app.js';
import { DEMO, DEMO_PASSWORD, signIn } from './people.js';
import { makeScope, mineFor, newPerson, submitCertificate, verifyCertificate, type Person } from './authorisations.js';

/**
 * One live-work scope and six people whose authorisations change at known times (Leipzig, UTC times):
 * A issued 2 Mar and left alone; B suspended 10 Mar, reinstated 12 Mar; C's first-aid certificate runs
 * out at the end of 20 Mar (the sweep records the suspension on 22 Mar); D revoked 15 Mar; E issued
 * 25 Mar; F's paper record from 10 Jan entered on 26 Mar. Every period ends at the end of 2 June.
 */
export async function buildRegisterScenario(t: TestApp, tag = 'Reg') {
  const manager = await signIn(t, DEMO.manager);
  const at = (iso: string) => t.clock.set(iso);
  at('2026-03-02T09:00:00Z');
  const scope = await makeScope(manager, { allowsLiveWork: true, validityMonths: 3, certificateGraceDays: 0, title: `${tag} live fault-finding` });
  const person = (letter: string) => newPerson(t, { name: `${tag} ${letter} ${Math.random().toString(36).slice(2, 6)}` });
  const [a, b, c, d, e, f] = await Promise.all(['A', 'B', 'C', 'D', 'E', 'F'].map(person));
  const certify = async (p: Person, expiresOn = '2029-01-05') => verifyCertificate(manager, await submitCertificate(p, { issuedOn: '2026-01-05', expiresOn }), DEMO_PASSWORD);
  for (const p of [a, b, d]) await certify(p);
  await certify(c, '2026-03-20');
  const id = async (p: Person) => (await mineFor(p, scope.id))!.id;
  const act = async (p: Person, action: string, reason: string) => {
    const res = await manager.post(`/api/authorisations/${await id(p)}/${action}`).send({ reason, password: DEMO_PASSWORD });
    if (res.status !== 200) throw new Error(`${action} failed: ${res.status} ${JSON.stringify(res.body)}`);
  };
  at('2026-03-10T10:00:00Z');
  await act(b, 'suspend', 'Earthed probe clipped to the isolated side');
  at('2026-03-12T10:00:00Z');
  await act(b, 'reinstate', 'Briefed again on differential probes');
  at('2026-03-15T10:00:00Z');
  await act(d, 'revoke', 'Worked live without a second person present');
  at('2026-03-22T08:00:00Z');
  await t.services.reminders.sweep();
  at('2026-03-25T09:00:00Z');
  await certify(e);
  at('2026-03-26T09:00:00Z');
  const prior = await manager.post('/api/authorisations/prior').send({
    holderId: f.id, scopeId: scope.id, issuedOn: '2026-01-10', expiresOn: '2026-12-31', attestedBy: 'H. Brandt, former workshop lead', note: 'Paper card 17', password: DEMO_PASSWORD,
  });
  if (prior.status !== 201) throw new Error(`prior record not written: ${prior.status} ${JSON.stringify(prior.body)}`);
  at('2026-06-05T12:00:00Z');
  await t.services.reminders.sweep();
  return { manager, scope, people: { a, b, c, d, e, f }, ids: { a: await id(a), b: await id(b), c: await id(c), d: await id(d), e: await id(e), f: await id(f) } };
}
export type RegisterScenario = Awaited<ReturnType<typeof buildRegisterScenario>>;

/** A person whose first-aid certificate comes with a scanned PNG, verified so a plain scope is issued on it. */
export async function personWithScan(t: TestApp, manager: Awaited<ReturnType<typeof signIn>>, scopeId: string, png: Buffer) {
  const p = await newPerson(t, { name: `Scan holder ${Math.random().toString(36).slice(2, 6)}` });
  const up = await p.post('/api/evidence').attach('file', png, { filename: 'first-aid-card.png', contentType: 'image/png' });
  if (up.status !== 201) throw new Error(`upload failed: ${up.status} ${JSON.stringify(up.body)}`);
  const certId = await submitCertificate(p, { issuedOn: '2026-01-05', expiresOn: '2029-01-05', evidenceId: up.body.id } as Parameters<typeof submitCertificate>[1]);
  await verifyCertificate(manager, certId, DEMO_PASSWORD);
  return { person: p, fileId: up.body.id as string, certId, authorisationId: (await mineFor(p, scopeId))!.id };
}
