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

const sweep = () => t.services.reminders.sweep();
const detail = async (id: string) => (await manager.get(`/api/authorisations/${id}`)).body;

describe('a prerequisite suspended, then reinstated', () => {
  it('when a manager suspends a scope others rest on, then they are suspended with it; reinstating brings both back; every change is signed with its reason', async () => {
    const base = await makeScope(manager, { requirements: [{ kind: 'certificate', certificateKind: 'cpr_aed' }] });
    const upper = await makeScope(manager, { allowsLiveWork: true, requirements: [{ kind: 'prerequisite', scopeId: base.id }, { kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const tech = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(tech, { kind: 'cpr_aed', issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const b = (await mineFor(tech, base.id))!;
    const u = (await mineFor(tech, upper.id))!;
    expect([b.state, u.state]).toEqual(['active', 'active']);

    const wrong = await manager.post(`/api/authorisations/${b.id}/suspend`).send({ reason: 'Isolation not proved before touching', password: 'not my password' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.password).toBeTruthy();
    expect((await mineFor(tech, base.id))!.state, 'a wrong password changes nothing').toBe('active');
    expect((await tech.post(`/api/authorisations/${b.id}/suspend`).send({ reason: 'x'.repeat(5), password: 'whatever' })).status).toBe(403);

    t.clock.advance(3_600_000);
    const suspended = await manager.post(`/api/authorisations/${b.id}/suspend`).send({ reason: 'Isolation not proved before touching the board', password: DEMO_PASSWORD });
    expect(suspended.status).toBe(200);
    expect((await mineFor(tech, base.id))!.state).toBe('suspended');
    const upperNow = (await mineFor(tech, upper.id))!;
    expect(upperNow.state, 'what rests on it is suspended too').toBe('suspended');
    expect((await detail(u.id)).reason).toMatch(new RegExp(`“${base.title}”, which this rests on, is suspended`));
    expect((await manager.post(`/api/authorisations/${u.id}/reinstate`).send({ reason: 'Reinstate the upper one', password: DEMO_PASSWORD })).status, 'only the prerequisite can lift it').toBe(409);

    t.clock.advance(3_600_000);
    expect((await manager.post(`/api/authorisations/${b.id}/reinstate`).send({ reason: 'Retrained on proving dead', password: DEMO_PASSWORD })).status).toBe(200);
    expect([(await mineFor(tech, base.id))!.state, (await mineFor(tech, upper.id))!.state]).toEqual(['active', 'active']);

    const events = (await detail(b.id)).periods[0].events as { kind: string; reason: string; actorName: string; signature: { printedName: string; meaning: string } | null }[];
    expect(events.map((e) => e.kind)).toEqual(['issued', 'suspended', 'reinstated']);
    expect(events[1]).toMatchObject({ reason: 'Isolation not proved before touching the board', actorName: 'Jörg Łukasik', signature: { printedName: 'Jörg Łukasik', meaning: 'Suspended this authorisation' } });
    expect(events[2]).toMatchObject({ reason: 'Retrained on proving dead', signature: { meaning: 'Reinstated this authorisation' } });
    const upperEvents = (await detail(u.id)).periods[0].events as { kind: string; actorName: string | null; signature: unknown }[];
    expect(upperEvents.map((e) => e.kind)).toEqual(['issued', 'suspended', 'reinstated']);
    expect(upperEvents[1], 'the cascade is the server\'s own decision').toMatchObject({ actorName: null, signature: null });
  });
});

describe('a certificate lapses under a live-work scope', () => {
  it('when the certificate expires, then the scope stays in force through the grace period, is suspended after it, shows "renewal submitted", and a verified renewal restores it with its original expiry', async () => {
    const live = await makeScope(manager, { allowsLiveWork: true, certificateGraceDays: 14, validityMonths: 12 });
    const tech = await newPerson(t);
    t.clock.set('2026-03-02T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2024-06-30', expiresOn: '2026-06-30' }), DEMO_PASSWORD);
    const issued = (await mineFor(tech, live.id))!;
    expect(issued.validUntil, 'a live-work scope is not cut to the certificate').toBe('2027-03-02');

    t.clock.set('2026-07-10T10:00:00Z');
    await sweep();
    expect((await mineFor(tech, live.id))!.state, 'inside the 14-day grace').toBe('active');

    t.clock.set('2026-07-16T10:00:00Z');
    await sweep();
    const suspended = await detail(issued.id);
    expect(suspended.state).toBe('suspended');
    const ev = suspended.periods[0].events.at(-1);
    expect(ev.kind).toBe('suspended');
    expect(ev.effectiveAt, 'end of 30 June in Leipzig plus 14 days').toBe('2026-07-14T22:00:00.000Z');
    expect(ev.reason).toMatch(/First aid and CPR certificate expired on 30 Jun 2026 and the 14-day grace period has ended/);

    const renewal = await submitCertificate(tech, { issuedOn: '2026-07-15', expiresOn: '2028-07-15' });
    expect((await mineFor(tech, live.id))!.state).toBe('renewal_submitted');
    t.clock.advance(DAY);
    await verifyCertificate(manager, renewal, DEMO_PASSWORD);
    const back = (await mineFor(tech, live.id))!;
    expect(back.state).toBe('active');
    expect(back.validUntil, 'the original expiry').toBe('2027-03-02');
    expect(back.periodId, 'the same period, not a new one').toBe(issued.periodId);
    const kinds = (await detail(issued.id)).periods[0].events.map((e: { kind: string }) => e.kind);
    expect(kinds).toEqual(['issued', 'suspended', 'renewal_submitted', 'restored']);
  });
});

describe('lapse at expiry by the clock', () => {
  it('when the clock passes the end, then it is lapsed at once; the sweep records the lapse at the end moment; stateAt answers for any moment', async () => {
    const scope = await makeScope(manager, { validityMonths: 1 });
    const tech = await newPerson(t);
    t.clock.set('2026-03-02T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const a = (await mineFor(tech, scope.id))!;
    expect(a.validUntil).toBe('2026-04-02');
    const end = new Date('2026-04-02T22:00:00Z'); // end of 2 April, Leipzig summer time

    t.clock.set(new Date(end.getTime() - 1000));
    expect((await mineFor(tech, scope.id))!.state).toBe('active');
    t.clock.set(new Date(end.getTime() + 1000));
    expect((await mineFor(tech, scope.id))!.state, 'derived from the end, before any sweep').toBe('lapsed');
    await sweep();
    const lapsed = (await detail(a.id)).periods[0].events.at(-1);
    expect(lapsed).toMatchObject({ kind: 'lapsed', effectiveAt: end.toISOString() });
    expect(new Date(lapsed.recordedAt).getTime()).toBeGreaterThan(end.getTime());

    const at = (iso: string) => stateAt(t.deps.db, { personId: tech.id, scopeId: scope.id }, new Date(iso)).then((s) => s.state);
    expect(await at('2026-03-01T12:00:00Z')).toBe('none');
    expect(await at('2026-03-20T12:00:00Z')).toBe('active');
    expect(await at('2026-04-10T12:00:00Z')).toBe('lapsed');
    expect((await stateAt(t.deps.db, { authorisationId: a.id }, new Date('2026-03-20T12:00:00Z'))).period?.id).toBe(a.periodId);
  });
});
