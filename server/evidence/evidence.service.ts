import { createHash } from 'node:crypto';
import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { EvidenceQuery, EvidenceRow, EvidenceUploadFields } from '../../shared/schemas/evidence.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { forbidden, notFound, unprocessable } from '../errors.js';
import { findUserById } from '../people/people.repository.js';
import * as repo from './evidence.repository.js';
import { EVIDENCE_LINKS } from './evidence.links.js';
import { nameProblem, safeFileName, sniff } from './evidence.sniff.js';

export interface UploadedFile {
  buffer: Buffer;
  originalname?: string;
}

function present(m: repo.EvidenceMeta): EvidenceRow {
  return { ...m, entity: m.entity as EvidenceRow['entity'], mediaType: m.mediaType as EvidenceRow['mediaType'], uploadedAt: m.uploadedAt.toISOString(), contentUrl: `/api/evidence/${m.id}/content` };
}

export function makeEvidenceService({ db, clock, audit }: Deps) {
  async function readable(ability: AppAbility, id: string) {
    const meta = await repo.findMeta(db, id);
    if (!meta) throw notFound('That evidence');
    if (!ability.can('read', subjectOf('Evidence', meta))) throw forbidden('You may not see this evidence.');
    return meta;
  }

  /** Checks who may attach to whose record, then the link, then the bytes; stores nothing unless all pass. */
  async function upload(actor: Actor, ability: AppAbility, fields: EvidenceUploadFields, file: UploadedFile | undefined) {
    const ownerId = fields.ownerId ?? actor.id;
    const owner = await findUserById(db, ownerId);
    if (!owner) throw unprocessable('ownerId: no such person', { ownerId: 'no such person' });
    if (!ability.can('create', subjectOf('Evidence', { ownerId, siteId: owner.siteId }))) {
      throw forbidden(ownerId === actor.id ? 'You may not upload evidence.' : "You may attach evidence to someone else's record only at the sites you cover.");
    }
    const entityId = fields.entityId ?? ownerId;
    const linkProblem = await EVIDENCE_LINKS[fields.entity](db, { entityId, ownerId });
    if (linkProblem) throw unprocessable(`entityId: ${linkProblem}`, { entityId: linkProblem });
    if (!file) throw unprocessable('file: attach a file', { file: 'attach a file' });
    const sniffed = sniff(file.buffer);
    if (sniffed.problem !== undefined) throw unprocessable(`file: ${sniffed.problem}`, { file: sniffed.problem });
    const fileName = safeFileName(file.originalname, sniffed.mediaType);
    const mismatch = nameProblem(fileName, sniffed.mediaType);
    if (mismatch) throw unprocessable(`file: ${mismatch}`, { file: mismatch });
    const sha256 = createHash('sha256').update(file.buffer).digest('hex');
    const meta = {
      ownerId, siteId: owner.siteId, uploaderId: actor.id, entity: fields.entity, entityId, fileName,
      mediaType: sniffed.mediaType, sizeBytes: file.buffer.length, sha256, caption: fields.caption || null,
    };
    const created = await db.transaction(async (tx) => {
      const row = await repo.insertEvidence(tx, { ...meta, content: file.buffer, uploadedAt: clock.now() });
      await audit(tx, { actorId: actor.id, action: 'evidence.uploaded', entity: 'evidence', entityId: row.id, newValues: meta });
      return row;
    });
    return present((await repo.findMeta(db, created.id))!);
  }

  async function list(ability: AppAbility, q: EvidenceQuery) {
    const access = accessibleWhere(ability, 'read', 'Evidence', repo.evidenceAccessColumns);
    const { items, total } = await repo.listEvidence(db, { ...q, access });
    return { items: items.map(present), total, page: q.page, pageSize: q.pageSize };
  }

  async function content(ability: AppAbility, id: string) {
    const meta = await readable(ability, id);
    const bytes = await repo.contentOf(db, id);
    if (!bytes) throw notFound('That evidence');
    return { meta: present(meta), bytes };
  }

  return { upload, list, get: async (ability: AppAbility, id: string) => present(await readable(ability, id)), content };
}
