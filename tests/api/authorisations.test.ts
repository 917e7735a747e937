import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, mineFor, newPerson, PERSON_PASSWORD, SAW_ORIGINAL, submitCertificate, verifyCertificate } from '../support/authorisations.js';
import { reevaluatePerson } from '../../server/authorisations/index.js';
import { insertCertificate } from '../../server/authorisations/certificates.repository.js';
import { insertSignature } from '../../server/signatures/signatures.repository.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
});

const periodsOf = async (holderId: string, scopeId: string) =>
  (await t.ownerQuery('select id, starts_at, ends_at, xmin::text as xmin from authorisation_periods where holder_id = $1 and scope_id = $2 order by starts_at', [holderId, scopeId])).rows;

describe('issue on the completing event', () => {
  it('when the first of two requirements is met, then nothing is issued; when the second is, then it is issued in that same transaction', async () => {
    const scope = await makeScope(manager, { requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }, { kind: 'certificate', certificateKind: 'release_from_live_parts' }] });
    const tech = await newPerson(t);
    const first = await submitCertificate(tech, { issuedOn: '2026-01-10', expiresOn: '2028-01-10' });
    const second = await submitCertificate(tech, { kind: 'release_from_live_parts', issuedOn: '2026-02-01', expiresOn: '2028-02-01' });
    await verifyCertificate(manager, first, DEMO_PASSWORD);
    expect(await mineFor(tech, scope.id), 'one requirement still open').toBeUndefined();
    const elig = (await tech.get(`/api/eligibility/${tech.id}/${scope.id}`)).body.scopes[0];
    expect(elig.eligible).toBe(false);
    expect(elig.requirements.map((r: { met: boolean }) => r.met)).toEqual([true, false]);
    expect(elig.requirements[1].detail).toMatch(/waits for a manager to check it/);

    t.clock.advance(60_000);
    await verifyCertificate(manager, second, DEMO_PASSWORD);
    const mine = await mineFor(tech, scope.id);
    expect(mine?.state).toBe('active');
    const [period] = await periodsOf(tech.id, scope.id);
    const cert = (await t.ownerQuery('select xmin::text as xmin, reviewed_at from external_certificates where id = $1', [second])).rows[0];
    expect(period.xmin, 'the period was written by the transaction that verified the certificate').toBe(cert.xmin);
    expect(new Date(period.starts_at).toISOString()).toBe(new Date(cert.reviewed_at).toISOString());
    const detail = (await tech.get(`/api/authorisations/${mine!.id}`)).body;
    expect(detail.periods[0].events.map((e: { kind: string }) => e.kind)).toEqual(['issued']);
    expect(detail.snapshot.requirements.every((r: { met: boolean }) => r.met)).toBe(true);
    expect(detail.snapshot.requirements[1].evidence[0].id).toBe(second);
  });

  it('when two managers verify the two completing certificates at the same moment, then exactly one authorisation is issued', async () => {
    const scope = await makeScope(manager, { requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }, { kind: 'certificate', certificateKind: 'cpr_aed' }] });
    const other = await newPerson(t, { roles: ['manager'] });
    for (let round = 0; round < 4; round++) {
      const tech = await newPerson(t);
      const a = await submitCertificate(tech, { issuedOn: '2026-01-10', expiresOn: '2028-01-10' });
      const b = await submitCertificate(tech, { kind: 'cpr_aed', issuedOn: '2026-01-12', expiresOn: '2028-01-12' });
      const [ra, rb] = await Promise.all([
        manager.post(`/api/certificates/${a}/verify`).send({ password: DEMO_PASSWORD, ...SAW_ORIGINAL }),
        other.post(`/api/certificates/${b}/verify`).send({ password: PERSON_PASSWORD, ...SAW_ORIGINAL }),
      ]);
      expect([ra.status, rb.status]).toEqual([200, 200]);
      expect((await periodsOf(tech.id, scope.id)).length, `round ${round}`).toBe(1);
    }
  });

  it('when the same requirement is completed twice at once, then still only one period exists', async () => {
    const scope = await makeScope(manager);
    const other = await newPerson(t, { roles: ['manager'] });
    const tech = await newPerson(t);
    const a = await submitCertificate(tech, { issuedOn: '2026-01-10', expiresOn: '2028-01-10' });
    const b = await submitCertificate(tech, { issuedOn: '2026-01-11', expiresOn: '2028-01-11', issuer: 'St John Ambulance' });
    const res = await Promise.all([
      manager.post(`/api/certificates/${a}/verify`).send({ password: DEMO_PASSWORD, ...SAW_ORIGINAL }),
      other.post(`/api/certificates/${b}/verify`).send({ password: PERSON_PASSWORD, ...SAW_ORIGINAL }),
    ]);
    expect(res.map((r) => r.status)).toEqual([200, 200]);
    expect((await periodsOf(tech.id, scope.id)).length).toBe(1);
  });

  it('when two transactions each record one completing certificate and re-evaluate at the same moment, then the person lock lets exactly one issue', async () => {
    const scope = await makeScope(manager, { requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }, { kind: 'certificate', certificateKind: 'electrical_qualification' }] });
    const tech = await newPerson(t);
    let arrived = 0;
    let release!: () => void;
    const bothInside = new Promise<void>((r) => (release = r));
    const complete = (kind: string) => t.deps.db.transaction(async (tx) => {
      const now = t.clock.now();
      const sig = await insertSignature(tx, { signerId: manager.user.id, printedName: 'Jörg Łukasik', meaning: 'Checked this certificate against the original', entity: 'external_certificate', entityId: kind, signedAt: now });
      await insertCertificate(tx, {
        holderId: tech.id, kind, issuer: 'Test issuer', reference: '', issuedOn: '2026-01-01', expiresOn: '2028-01-01', validUntil: new Date('2028-01-02T00:00:00Z'),
        status: 'verified', submittedBy: tech.id, submittedAt: now, reviewedBy: manager.user.id, reviewedAt: now, signatureId: sig.id,
      });
      // Both certificates are written (neither committed) before either transaction decides.
      if (++arrived === 2) release();
      await bothInside;
      return reevaluatePerson(tx, tech.id, { ...t.deps, actorId: manager.user.id });
    });
    const [a, b] = await Promise.all([complete('first_aid_cpr'), complete('electrical_qualification')]);
    expect([...a, ...b].filter((c) => c.kind === 'issued' && c.scopeId === scope.id).length).toBe(1);
    expect((await periodsOf(tech.id, scope.id)).length).toBe(1);
  });

  it('when the database is asked to store two overlapping periods of one scope for one person, then its exclusion constraint refuses', async () => {
    const scope = await makeScope(manager);
    const tech = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-10', expiresOn: '2028-01-10' }), DEMO_PASSWORD);
    const [p] = (await t.ownerQuery('select * from authorisation_periods where holder_id = $1 and scope_id = $2', [tech.id, scope.id])).rows;
    const copy = t.ownerQuery(
      `insert into authorisation_periods (authorisation_id, holder_id, scope_id, starts_at, ends_at, validity_ends_at, origin, verification_code, evidence_snapshot, recorded_at)
       values ($1, $2, $3, $4::timestamptz + interval '1 day', $5, $5, 'issued', $6, '{}', now())`,
      [p.authorisation_id, p.holder_id, p.scope_id, p.starts_at, p.ends_at, 'A'.repeat(32)],
    );
    await expect(copy).rejects.toThrow(/authorisation_periods_no_overlap/);
  });
});

describe('expiry', () => {
  it('when a certificate runs out before the validity, then the expiry is the certificate\'s; a verified renewal brings it back up to the validity', async () => {
    const scope = await makeScope(manager, { validityMonths: 12 });
    const tech = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2025-09-30', expiresOn: '2026-09-30' }), DEMO_PASSWORD);
    const mine = await mineFor(tech, scope.id);
    expect(mine?.validUntil, 'first aid expires first').toBe('2026-09-30');
    expect(mine?.renew.map((h) => h.detail).join(' ')).toMatch(/It runs out on 30 Sept? 2026/);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-03-01', expiresOn: '2028-03-01' }), DEMO_PASSWORD);
    expect((await mineFor(tech, scope.id))?.validUntil, '12 months from issue on 2 March 2026').toBe('2027-03-02');
  });

  it('when a scope rests on another that ends sooner, then its expiry is that one\'s', async () => {
    const base = await makeScope(manager, { validityMonths: 6, requirements: [{ kind: 'certificate', certificateKind: 'cpr_aed' }] });
    const upper = await makeScope(manager, { validityMonths: 24, requirements: [{ kind: 'prerequisite', scopeId: base.id }, { kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const tech = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    await verifyCertificate(manager, await submitCertificate(tech, { kind: 'cpr_aed', issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    expect((await mineFor(tech, base.id))?.validUntil, 'six months of validity').toBe('2026-09-02');
    expect((await mineFor(tech, upper.id))?.validUntil, 'no later than what it rests on').toBe('2026-09-02');
  });
});
