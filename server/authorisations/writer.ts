import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import type { Audit } from '../audit/audit.service.js';
import type { EventKind } from '../../shared/authorisations/kinds.js';
import { insertEvent, setPeriodEnd, type EventInsert } from './periods.repository.js';
import type { Standing } from './eligibility.js';

/** What a caller passes to reevaluatePerson: the app's clock and audit, and who set it off. */
export interface EvaluationContext {
  clock: Clock;
  audit: Audit;
  /** The person whose action led to the evaluation (null: the server itself, e.g. the sweep). */
  actorId?: string | null;
}

export interface Change {
  kind: EventKind | 'expiry_changed';
  scopeId: string;
  authorisationId: string;
  periodId: string;
}

/** One evaluation's writes: every event goes to the audit trail in the same transaction. */
export class Writer {
  readonly changes: Change[] = [];
  constructor(
    readonly tx: Executor,
    readonly ctx: EvaluationContext,
    readonly now: Date,
  ) {}

  get actorId() {
    return this.ctx.actorId ?? null;
  }

  async event(st: Standing, e: Omit<EventInsert, 'periodId' | 'recordedAt'> & { kind: EventKind }) {
    const row = await insertEvent(this.tx, { ...e, periodId: st.period.id, recordedAt: this.now });
    st.events.push(row);
    st.events.sort((a, b) => a.effectiveAt.getTime() - b.effectiveAt.getTime() || a.recordedAt.getTime() - b.recordedAt.getTime());
    await this.ctx.audit(this.tx, {
      actorId: e.actorId ?? null, action: `authorisation.${e.kind}`, entity: 'authorisation_period', entityId: st.period.id,
      newValues: { eventId: row.id, effectiveAt: row.effectiveAt, reason: row.reason, cause: row.cause, signatureId: row.signatureId, details: row.details, triggeredBy: this.actorId },
    });
    this.changes.push({ kind: e.kind, scopeId: st.period.scopeId, authorisationId: st.authorisationId, periodId: st.period.id });
    return row;
  }

  async moveEnd(st: Standing, endsAt: Date, reason: string) {
    const before = st.period.endsAt;
    await setPeriodEnd(this.tx, st.period.id, endsAt);
    st.period = { ...st.period, endsAt };
    await this.ctx.audit(this.tx, {
      actorId: null, action: 'authorisation.expiry_changed', entity: 'authorisation_period', entityId: st.period.id,
      oldValues: { endsAt: before }, newValues: { endsAt, reason, triggeredBy: this.actorId },
    });
    this.changes.push({ kind: 'expiry_changed', scopeId: st.period.scopeId, authorisationId: st.authorisationId, periodId: st.period.id });
  }
}
