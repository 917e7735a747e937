import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { VERIFY_CERTIFICATE_MEANING } from '../../shared/authorisations/kinds.js';
import type { CertificateBody, CertificatesQuery } from '../../shared/schemas/authorisations.js';
import type { CertificateCheckBody } from '../../shared/schemas/certificate-check.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import * as repo from './certificates.repository.js';
import { findPerson, lockPerson, type PersonRow } from './facts.repository.js';
import { namesOf } from './authorisations.repository.js';
import { reevaluatePerson } from './issuing.js';
import { presentCertificate } from './present.js';
import { endOfLocalDay, localDate } from './dates.js';

export function makeCertificatesService(deps: Deps, signatures: Signatures) {
  const { db, clock, audit } = deps;

  async function view(c: repo.CertificateRow) {
    const person = (await findPerson(db, c.holderId))!;
    const names = await namesOf(db, c.reviewedBy ? [c.reviewedBy] : []);
    return presentCertificate(c, { holderName: person.name, siteName: person.siteName, reviewerName: c.reviewedBy ? (names.get(c.reviewedBy) ?? null) : null }, clock.now());
  }

  async function holderOf(id: string): Promise<PersonRow> {
    const person = await findPerson(db, id);
    if (!person) throw unprocessable('holderId: no such person', { holderId: 'no such person' });
    return person;
  }

  async function submit(actor: Actor, ability: AppAbility, body: CertificateBody) {
    const holder = await holderOf(body.holderId ?? actor.id);
    if (!ability.can('create', subjectOf('Certificate', { holderId: holder.id, siteId: holder.siteId }))) throw forbidden('You may not add certificates for this person.');
    if (body.expiresOn <= body.issuedOn) throw unprocessable('expiresOn: must be after the issue date', { expiresOn: 'must be after the issue date' });
    if (body.issuedOn > localDate(clock.now(), holder.timeZone)) throw unprocessable('issuedOn: cannot be in the future', { issuedOn: 'cannot be in the future' });
    if (body.evidenceId) {
      const file = await repo.evidenceOwner(db, body.evidenceId);
      if (!file || file.ownerId !== holder.id) throw unprocessable('evidenceId: no such upload among this person\'s files', { evidenceId: 'no such upload among this person\'s files' });
    }
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      await lockPerson(tx, holder.id);
      const row = await repo.insertCertificate(tx, {
        holderId: holder.id, kind: body.kind, issuer: body.issuer, reference: body.reference, issuedOn: body.issuedOn, expiresOn: body.expiresOn,
        validUntil: endOfLocalDay(body.expiresOn, holder.timeZone), evidenceId: body.evidenceId ?? null, status: 'submitted', submittedBy: actor.id, submittedAt: now,
      });
      await audit(tx, { actorId: actor.id, action: 'certificate.submitted', entity: 'external_certificate', entityId: row.id, newValues: body });
      await reevaluatePerson(tx, holder.id, { ...deps, actorId: actor.id });
      return row;
    });
    return view(created);
  }

  async function reviewable(actor: Actor, ability: AppAbility, id: string) {
    const cert = await repo.findCertificate(db, id);
    if (!cert) throw notFound('That certificate');
    const holder = (await findPerson(db, cert.holderId))!;
    if (!ability.can('update', subjectOf('Certificate', { holderId: holder.id, siteId: holder.siteId }))) throw forbidden('You may check certificates only for people at your sites.');
    if (holder.id === actor.id) throw forbidden('You may not check your own certificate.');
    if (cert.status !== 'submitted') throw conflict(`This certificate was already ${cert.status}.`);
    return cert;
  }

  /** A manager checks the certificate against the original and signs; what rests on it is decided in the same transaction. */
  async function verify(actor: Actor, ability: AppAbility, id: string, body: CertificateCheckBody) {
    const cert = await reviewable(actor, ability, id);
    const how = await howChecked(cert, body);
    const signer = await signatures.verify(actor.id, body.password);
    const row = await db.transaction(async (tx) => {
      await lockPerson(tx, cert.holderId);
      if ((await repo.findCertificate(tx, id, true))?.status !== 'submitted') throw conflict('This certificate was checked a moment ago.');
      const sig = await signatures.record(tx, signer, { meaning: VERIFY_CERTIFICATE_MEANING, entity: 'external_certificate', entityId: id });
      const updated = await repo.updateCertificate(tx, id, { status: 'verified', reviewedBy: actor.id, reviewedAt: sig.signedAt, signatureId: sig.id, ...how });
      await audit(tx, { actorId: actor.id, action: 'certificate.verified', entity: 'external_certificate', entityId: id, oldValues: { status: 'submitted' }, newValues: { status: 'verified', signatureId: sig.id, ...how } });
      await reevaluatePerson(tx, cert.holderId, { ...deps, actorId: actor.id });
      return updated;
    });
    return view(row);
  }

  /** A scan on file, or the original seen in person (where, on a day not in the future); refused naming the field otherwise. */
  async function howChecked(cert: repo.CertificateRow, body: CertificateCheckBody) {
    if (!body.sawOriginal) {
      if (cert.evidenceId) return { checkedHow: 'scan', originalSeenWhere: null, originalSeenOn: null };
      throw unprocessable('sawOriginal: no scan is on file: attach one, or state that you saw the original in person, where and when', { sawOriginal: 'no scan is on file: state that you saw the original in person' });
    }
    if (!body.sawOriginalWhere) throw unprocessable('sawOriginalWhere: say where you saw the original', { sawOriginalWhere: 'say where you saw the original' });
    const holder = (await findPerson(db, cert.holderId))!;
    const today = localDate(clock.now(), holder.timeZone);
    const on = body.sawOriginalOn ?? today;
    if (on > today) throw unprocessable('sawOriginalOn: cannot be in the future', { sawOriginalOn: 'cannot be in the future' });
    if (on < cert.issuedOn) throw unprocessable('sawOriginalOn: cannot be before the certificate was issued', { sawOriginalOn: 'cannot be before the certificate was issued' });
    return { checkedHow: 'original_seen', originalSeenWhere: body.sawOriginalWhere, originalSeenOn: on };
  }

  async function reject(actor: Actor, ability: AppAbility, id: string, reason: string) {
    const cert = await reviewable(actor, ability, id);
    const row = await db.transaction(async (tx) => {
      await lockPerson(tx, cert.holderId);
      if ((await repo.findCertificate(tx, id, true))?.status !== 'submitted') throw conflict('This certificate was checked a moment ago.');
      const updated = await repo.updateCertificate(tx, id, { status: 'rejected', reviewedBy: actor.id, reviewedAt: clock.now(), rejectionReason: reason });
      await audit(tx, { actorId: actor.id, action: 'certificate.rejected', entity: 'external_certificate', entityId: id, oldValues: { status: 'submitted' }, newValues: { status: 'rejected', reason } });
      await reevaluatePerson(tx, cert.holderId, { ...deps, actorId: actor.id });
      return updated;
    });
    return view(row);
  }

  async function list(ability: AppAbility, q: CertificatesQuery) {
    const access = accessibleWhere(ability, 'read', 'Certificate', repo.certificateAccessColumns);
    const { items, total } = await repo.listCertificates(db, { ...q, access });
    const now = clock.now();
    return {
      items: items.map((i) => presentCertificate(i.certificate, { holderName: i.holderName, siteName: i.siteName, reviewerName: i.reviewerName }, now)),
      total, page: q.page, pageSize: q.pageSize,
    };
  }

  return { submit, verify, reject, list };
}
