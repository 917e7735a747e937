import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, mineFor, newPerson, submitCertificate, verifyCertificate } from '../support/authorisations.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  // The demo's own scopes are decided once by a first sweep, so each test below sees only its own change.
  await t.services.reminders.sweep();
});

describe('a new or edited scope is decided for everyone it concerns', () => {
  it('when a manager defines a scope that people already meet, then the next sweep issues it to them, and to nobody else', async () => {
    const ready = await newPerson(t);
    const notYet = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(ready, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    await submitCertificate(notYet, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' });
    const scope = await makeScope(manager, { title: 'Heater regulator repair (defined later)' });
    expect(await mineFor(ready, scope.id), 'nothing happens in the request itself').toBeUndefined();

    t.clock.advance(60_000);
    const first = await t.services.reminders.sweep();
    expect(first.reevaluated).toBeGreaterThanOrEqual(1);
    expect((await mineFor(ready, scope.id))?.state).toBe('active');
    expect(await mineFor(notYet, scope.id), 'an unverified certificate is not evidence').toBeUndefined();
    const snapshot = (await t.ownerQuery(`select evidence_snapshot->'completedBy' as by from authorisation_periods where holder_id = $1 and scope_id = $2`, [ready.id, scope.id])).rows;
    expect(snapshot).toHaveLength(1);

    const again = await t.services.reminders.sweep();
    expect(again.reevaluated, 'once decided, the scope is not decided again').toBe(0);
  });

  it('when a requirement nobody had is dropped from a scope, then the sweep after the edit issues it to those who now meet it', async () => {
    const person = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(person, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const body = {
      code: `CHG-${Math.random().toString(36).slice(2, 6).toUpperCase()}`, title: 'Motor controller fault-finding (edited)', description: '', maxVoltageV: 250, maxCurrentA: 10,
      allowsLiveWork: false, validityMonths: 12, reminderOffsetsDays: [30], certificateGraceDays: 0,
      requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }, { kind: 'certificate', certificateKind: 'cpr_aed' }],
    };
    const created = await manager.post('/api/scopes').send(body);
    expect(created.status).toBe(201);
    t.clock.advance(60_000);
    await t.services.reminders.sweep();
    expect(await mineFor(person, created.body.id), 'a second certificate is still missing').toBeUndefined();

    t.clock.advance(60_000);
    const edited = await manager.put(`/api/scopes/${created.body.id}`).send({ ...body, requirements: [body.requirements[0]] });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    await t.services.reminders.sweep();
    expect((await mineFor(person, created.body.id))?.state).toBe('active');
  });
});
