import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { DAY, makeScope, mineFor, newPerson, submitCertificate, verifyCertificate } from '../support/authorisations.js';
import { stateAt } from '../../server/authorisations/index.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
});

const detail = async (id: string) => (await manager.get(`/api/authorisations/${id}`)).body;

describe('revocation', () => {
  it('when revoked, then it ends at once with the signed reason, and only fresh evidence brings it back as a new period', async () => {
    const scope = await makeScope(manager, { requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const tech = await newPerson(t);
    t.clock.set('2026-03-02T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const a = (await mineFor(tech, scope.id))!;
    t.clock.advance(DAY);
    const res = await manager.post(`/api/authorisations/${a.id}/revoke`).send({ reason: 'Worked live on a board without a permit', password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    const d = await detail(a.id);
    expect(d.state).toBe('revoked');
    expect(d.periods[0].events.at(-1)).toMatchObject({ kind: 'revoked', reason: 'Worked live on a board without a permit', signature: { meaning: 'Revoked this authorisation' } });
    expect((await manager.post(`/api/authorisations/${a.id}/revoke`).send({ reason: 'again', password: DEMO_PASSWORD })).status).toBe(409);

    t.clock.advance(DAY);
    await verifyCertificate(manager, await submitCertificate(tech, { kind: 'cpr_aed', issuedOn: '2026-03-01', expiresOn: '2028-03-01' }), DEMO_PASSWORD);
    expect((await mineFor(tech, scope.id))!.state, 'evidence of another kind does not bring it back').toBe('revoked');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-03-03', expiresOn: '2028-03-03' }), DEMO_PASSWORD);
    const again = (await mineFor(tech, scope.id))!;
    expect(again.state).toBe('active');
    expect(again.periodId).not.toBe(a.periodId);
    expect((await detail(a.id)).periods.map((p: { events: { kind: string }[] }) => p.events[0].kind)).toEqual(['issued', 'issued']);
  });
});

describe('a person who leaves', () => {
  it('when a manager switches a person off with a reason, then their authorisations end with that reason and their certificate code is no longer current', async () => {
    const scope = await makeScope(manager);
    const tech = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const a = (await mineFor(tech, scope.id))!;
    const code = (await t.ownerQuery('select verification_code from authorisation_periods where id = $1', [a.periodId])).rows[0].verification_code;
    expect((await t.request().get(`/api/verify/${code}`)).body.state).toBe('current');
    t.clock.advance(DAY);
    const off = await manager.patch(`/api/people/${tech.id}`).send({ active: false, deactivatedReason: 'Moved to another employer' });
    expect(off.status).toBe(200);
    const d = await detail(a.id);
    expect(d.state).toBe('ended');
    expect(d.periods[0].events.at(-1)).toMatchObject({ kind: 'ended', reason: 'The holder left: Moved to another employer', actorName: 'Jörg Łukasik' });
    expect((await t.request().get(`/api/verify/${code}`)).body.state).toBe('not current');
  });
});

describe('renewal', () => {
  it('when the requirements are met again inside the renewal window, then a new period starts and the old one is kept; outside the window nothing changes', async () => {
    const scope = await makeScope(manager, { validityMonths: 12, reminderOffsetsDays: [60, 14] });
    const tech = await newPerson(t);
    t.clock.set('2026-03-02T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const first = (await mineFor(tech, scope.id))!;

    t.clock.set('2026-10-01T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-09-30', expiresOn: '2029-09-30' }), DEMO_PASSWORD);
    expect((await mineFor(tech, scope.id))!.periodId, 'five months before expiry: not yet').toBe(first.periodId);

    t.clock.set('2027-01-20T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2027-01-19', expiresOn: '2030-01-19' }), DEMO_PASSWORD);
    const renewed = (await mineFor(tech, scope.id))!;
    expect(renewed.periodId).not.toBe(first.periodId);
    expect(renewed.validFrom).toBe('2027-01-20');
    expect(renewed.validUntil).toBe('2028-01-20');
    const periods = (await detail(first.id)).periods as { id: string; validUntil: string; events: { kind: string }[] }[];
    expect(periods.map((p) => p.events[0].kind)).toEqual(['renewed', 'issued']);
    expect(periods[1]).toMatchObject({ id: first.periodId, validUntil: '2027-01-20', endsAt: '2027-01-20T09:00:00.000Z' });
    expect((await stateAt(t.deps.db, { personId: tech.id, scopeId: scope.id }, new Date('2026-12-01T00:00:00Z'))).period?.id, 'history answers for before the renewal').toBe(first.periodId);
    // The first period ran to the end of 2 March 2027 on the site's clock (Central European Time, UTC+1).
    const moved = await t.ownerQuery(
      `select old_values->>'endsAt' as before, new_values->>'endsAt' as after, new_values->>'reason' as reason from audit_log
       where action = 'authorisation.expiry_changed' and entity_id = $1`, [first.periodId]);
    expect(moved.rows, 'cutting the old period short is in the audit trail').toEqual([
      { before: '2027-03-02T23:00:00.000Z', after: '2027-01-20T09:00:00.000Z', reason: 'Renewed: the new period starts now.' },
    ]);
  });
});
