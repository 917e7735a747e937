import type { Executor } from '../db/client.js';
import type { EntryBody } from '../../shared/schemas/signoffs.js';
import type { Expectations } from '../../shared/practicals/expectations.js';
import { expectationOf, judgeReading, NO_EXPECTATION } from '../../shared/practicals/entries.js';
import { findPreset } from '../../shared/engine/limits.js';
import { unprocessable } from '../errors.js';
import { findMeta } from '../evidence/evidence.repository.js';
import type { Usability } from '../benches/usability.service.js';
import type { RecordChecklist } from './checklist.js';
import type { EntryFields } from './records.repository.js';

type Item = RecordChecklist['items'][number];

export interface EntryContext {
  db: Executor;
  usability: Usability;
  item: Item;
  body: EntryBody;
  /** The record the entry belongs to, for its evidence and its instruments. */
  record: { entity: 'signoff' | 'practical'; id: string; siteId: string };
  /** Practicals: the engine's figures, the bench's supply voltage, and the assessor judging. */
  quantities: Expectations['quantities'] | null;
  circuitVoltage?: number;
  assessing: boolean;
  at: Date;
  actorId: string;
}

const refuse = (field: string, message: string) => unprocessable(`${field}: ${message}`, { [field]: message });

/** Checks one entry against its item and judges it; the returned fields are what gets stored. */
export async function buildEntry(c: EntryContext): Promise<EntryFields> {
  const { item, body } = c;
  // Only a practical keeps every reading; nothing else would store the reason.
  if (body.reason && (c.record.entity !== 'practical' || item.kind !== 'measurement')) throw refuse('reason', 'only a reading of a practical taken again carries a reason');
  const blank: EntryFields = {
    kind: item.kind, checked: null, text: null, evidenceId: null, value: null, didNotTrip: false, unit: null, instrumentId: null,
    expected: null, tolerance: null, verdict: null, judgedBy: null, ruleText: null, source: null, note: body.note || null, recordedAt: c.at, recordedBy: c.actorId,
  };
  switch (item.kind) {
    case 'tick':
      if (body.checked === undefined) throw refuse('checked', 'tick or untick the item');
      return { ...blank, checked: body.checked };
    case 'text':
      if (!body.text) throw refuse('text', 'write the answer');
      return { ...blank, text: body.text };
    case 'evidence': {
      if (!body.evidenceId) throw refuse('evidenceId', 'upload the file, then attach it to this item');
      const meta = await findMeta(c.db, body.evidenceId);
      if (!meta || meta.entity !== c.record.entity || meta.entityId !== c.record.id) throw refuse('evidenceId', 'that file was not uploaded to this record');
      return { ...blank, evidenceId: meta.id };
    }
    case 'measurement':
      return measurement(c, blank);
    default:
      throw refuse('itemId', `items of kind ${item.kind} cannot be filled in`);
  }
}

async function measurement(c: EntryContext, blank: EntryFields): Promise<EntryFields> {
  const { item, body } = c;
  const rule = item.rule!;
  if (body.value === undefined) throw refuse('value', `enter the reading in ${item.unit}`);
  if (!body.unit) throw refuse('unit', `give the unit (${item.unit})`);
  if (body.unit !== item.unit) throw refuse('unit', `this item is measured in ${item.unit}, not ${body.unit}`);
  const preset = rule.type === 'preset' ? findPreset(rule.presetId) : undefined;
  if (body.value === 'did-not-trip' && !(preset && (preset.unit === 'ms' || preset.unit === 's'))) throw refuse('value', '"did not trip" is a reading only for a trip-time test');
  if (c.assessing && !body.instrumentId) throw refuse('instrumentId', 'choose the instrument the reading was taken with');
  if (body.instrumentId) {
    const { instrument } = await c.usability.checkInstrumentUsable(body.instrumentId, c.at, c.circuitVoltage, c.db);
    if (instrument.siteId !== c.record.siteId) throw refuse('instrumentId', `instrument SN ${instrument.serial} belongs to another site`);
  }
  const noExpectation = Boolean(expectationOf(rule, c.quantities) && expectationOf(rule, c.quantities)!.expected === null);
  if (body.assessorVerdict && !noExpectation) throw refuse('assessorVerdict', 'the acceptance rule judges this reading; leave the verdict to it');
  if (body.assessorVerdict && !c.assessing) throw refuse('assessorVerdict', 'only the assessor judges a reading');
  if (noExpectation && c.assessing && !body.assessorVerdict) throw refuse('assessorVerdict', `${NO_EXPECTATION}: say whether the reading is acceptable`);
  const j = judgeReading(rule, item.unit!, body.value, c.quantities, body.assessorVerdict);
  return {
    ...blank, value: body.value === 'did-not-trip' ? null : body.value, didNotTrip: body.value === 'did-not-trip', unit: body.unit,
    instrumentId: body.instrumentId ?? null, expected: j.expected, tolerance: j.tolerance, verdict: j.verdict, judgedBy: j.judgedBy, ruleText: j.ruleText, source: j.source,
  };
}
