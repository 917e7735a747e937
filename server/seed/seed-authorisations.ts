import { randomUUID } from 'node:crypto';
import type { SeedStep } from './index.js';
import { localDate } from '../../shared/time.js';
import { PRIOR_MEANING, VERIFY_CERTIFICATE_MEANING, type CertificateKind } from '../../shared/authorisations/kinds.js';
import type { Audit } from '../audit/audit.service.js';
import { insertSignature } from '../signatures/signatures.repository.js';
import { findPerson } from '../authorisations/facts.repository.js';
import { insertCertificate } from '../authorisations/certificates.repository.js';
import { insertScope, procedureIdsByCode, replaceRequirements, scopesWithRequirements } from '../authorisations/scopes.repository.js';
import { writePrior } from '../authorisations/prior.js';
import { Writer } from '../authorisations/writer.js';
import { endOfLocalDay } from '../authorisations/dates.js';
import { DEMO_SCOPES, DEMO_CERTIFICATES, DEMO_PRIORS } from './demo-authorisations.js';

/**
 * Scopes, first-aid and release-from-live-parts certificates, and authorisations held on paper before the
 * portal, for the demo people. Dates count from the day the demo is seeded; one paper authorisation and
 * one certificate run out within 30 days so the reminders have something to say. Invented data.
 */
export const seedAuthorisations: SeedStep = async (tx, clock, audit, ctx) => {
  const now = clock.now();
  const day = (offset: number, tz: string) => localDate(new Date(now.getTime() + offset * 86_400_000), tz);
  // Demo records are marked as seeded in the audit trail, like the people and sites before them.
  const seedAudit: Audit = (t, e) => audit(t, { ...e, action: e.action.startsWith('seed.') ? e.action : `seed.${e.action}` });
  const procs = await procedureIdsByCode(tx, [...new Set(DEMO_SCOPES.flatMap((s) => s.requirements.flatMap((r) => ('procedure' in r ? [r.procedure] : []))))]);
  const scopeIds: Record<string, string> = {};
  for (const { requirements, ...s } of DEMO_SCOPES) {
    const row = await insertScope(tx, { ...s, active: true, createdBy: ctx.people['manager@demo.breakover.test'], createdAt: now, updatedAt: now });
    scopeIds[s.code] = row.id;
    type Row = Parameters<typeof replaceRequirements>[2][number];
    await replaceRequirements(tx, row.id, requirements.flatMap((r): Row[] => {
      if (r.kind === 'prerequisite') return [{ kind: r.kind, prerequisiteScopeId: scopeIds[r.scope] }];
      if (r.kind === 'certificate') return [{ kind: r.kind, certificateKind: r.certificateKind }];
      const procedureId = procs.get(r.procedure);
      // A demo procedure left out of the procedures seed leaves its requirement out too.
      if (!procedureId) return [];
      return [{ kind: r.kind, procedureId, practicalsCount: r.kind === 'practicals' ? r.count : null, practicalsWindowMonths: r.kind === 'practicals' ? r.windowMonths : null }];
    }));
    await seedAudit(tx, { actorId: null, action: 'seed.scope', entity: 'scope', entityId: row.id, newValues: { code: s.code } });
  }

  for (const c of DEMO_CERTIFICATES) {
    const holder = (await findPerson(tx, ctx.people[c.holder]))!;
    const reviewer = c.verifiedBy ? (await findPerson(tx, ctx.people[c.verifiedBy]))! : null;
    const submittedAt = new Date(now.getTime() - c.submittedDaysAgo * 86_400_000);
    const id = randomUUID();
    const sig = reviewer ? await insertSignature(tx, { signerId: reviewer.id, printedName: reviewer.name, meaning: VERIFY_CERTIFICATE_MEANING, entity: 'external_certificate', entityId: id, signedAt: submittedAt }) : null;
    const expiresOn = day(c.expiresInDays, holder.timeZone);
    await insertCertificate(tx, {
      id, holderId: holder.id, kind: c.kind as CertificateKind, issuer: c.issuer, reference: c.reference, issuedOn: day(-c.issuedDaysAgo, holder.timeZone), expiresOn,
      validUntil: endOfLocalDay(expiresOn, holder.timeZone), status: reviewer ? 'verified' : 'submitted', submittedBy: holder.id, submittedAt,
      reviewedBy: reviewer?.id ?? null, reviewedAt: reviewer ? submittedAt : null, signatureId: sig?.id ?? null,
    });
    await seedAudit(tx, { actorId: null, action: 'seed.certificate', entity: 'external_certificate', entityId: id, newValues: { holder: c.holder, kind: c.kind } });
  }

  const scopes = new Map((await scopesWithRequirements(tx)).map((s) => [s.code, s]));
  for (const p of DEMO_PRIORS) {
    const holder = (await findPerson(tx, ctx.people[p.holder]))!;
    const recorder = (await findPerson(tx, ctx.people[p.recordedBy]))!;
    const w = new Writer(tx, { clock, audit: seedAudit, actorId: recorder.id }, now);
    const periodId = randomUUID();
    const sig = await insertSignature(tx, { signerId: recorder.id, printedName: recorder.name, meaning: PRIOR_MEANING, entity: 'authorisation_period', entityId: periodId, signedAt: now });
    await writePrior(tx, w, holder, scopes.get(p.scope)!, {
      issuedOn: day(-p.issuedDaysAgo, holder.timeZone), expiresOn: day(p.expiresInDays, holder.timeZone), attestedBy: p.attestedBy, evidenceId: null, note: p.note,
      origin: 'prior', signatureId: sig.id, periodId,
    });
  }
};
