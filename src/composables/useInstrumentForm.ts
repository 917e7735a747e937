import { computed, reactive } from 'vue';
import type { InstrumentBody, InstrumentRow, InstrumentUpdateBody } from '@/api';

type Form = Omit<InstrumentBody, 'siteId'> & { siteId: string | null };
const KEYS = ['siteId', 'kind', 'make', 'model', 'serial', 'measurementCategory', 'voltageRating', 'trueRms', 'calibrationDueOn', 'notes', 'active'] as const;

const blank = (): Form => ({
  siteId: null, kind: 'multimeter', make: '', model: '', serial: '', measurementCategory: 'CAT III', voltageRating: 600, trueRms: true,
  calibrationDueOn: '', notes: null, active: true,
});

/** The instrument dialog's fields; on edit only what changed is sent. */
export function useInstrumentForm() {
  const form = reactive<Form>(blank());
  let original: InstrumentRow | null = null;

  function reset(instrument: InstrumentRow | null, defaultSiteId: string | null) {
    original = instrument;
    Object.assign(form, instrument ? { ...instrument } : { ...blank(), siteId: defaultSiteId });
  }

  function tidy(): Form {
    const rated = form.measurementCategory !== null;
    const v = form.voltageRating as unknown;
    return {
      ...form, make: form.make.trim(), model: form.model.trim(), serial: form.serial.trim(), notes: form.notes?.trim() || null,
      voltageRating: rated && v !== '' && v !== null ? Number(v) : null,
    };
  }

  const createBody = computed<InstrumentBody>(() => ({ ...tidy(), siteId: form.siteId ?? '' }));
  const changes = computed<InstrumentUpdateBody>(() => {
    if (!original) return {};
    const next = tidy();
    const body: Record<string, unknown> = {};
    for (const k of KEYS) if (next[k] !== original[k]) body[k] = next[k];
    return body as InstrumentUpdateBody;
  });
  return { form, reset, createBody, changes };
}
