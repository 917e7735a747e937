import { computed, reactive } from 'vue';
import type { BenchBody, BenchRow, BenchUpdateBody } from '@/api';

type Form = Omit<BenchBody, 'siteId' | 'supplyFrequency'> & { siteId: string | null; supplyFrequency: 50 | 60 };

const blank = (): Form => ({
  siteId: null, code: '', name: '', supplyVoltage: 230, supplyFrequency: 50, isolatingTransformer: true, isolatingTransformerVa: null,
  rcdType: 'A', rcdRatedResidualMa: 30, emergencyStop: true, nextInspectionOn: '', notes: null, active: true,
});

/** The bench dialog's fields; on edit only what changed is sent, and the pairs that go together are cleared together. */
export function useBenchForm() {
  const form = reactive<Form>(blank());
  let original: BenchRow | null = null;

  function reset(bench: BenchRow | null, defaultSiteId: string | null) {
    original = bench;
    Object.assign(form, bench ? { ...bench, notes: bench.notes } : { ...blank(), siteId: defaultSiteId });
  }

  function tidy(): Form {
    return {
      ...form,
      code: form.code.trim().toUpperCase(),
      isolatingTransformerVa: form.isolatingTransformer ? numberOrNull(form.isolatingTransformerVa) : null,
      rcdRatedResidualMa: form.rcdType ? numberOrNull(form.rcdRatedResidualMa) : null,
      supplyVoltage: Number(form.supplyVoltage),
      notes: form.notes?.trim() || null,
    };
  }

  const createBody = computed<BenchBody>(() => ({ ...tidy(), siteId: form.siteId ?? '' }));
  const changes = computed<BenchUpdateBody>(() => {
    if (!original) return {};
    const next = tidy();
    const keys = ['code', 'name', 'supplyVoltage', 'supplyFrequency', 'isolatingTransformer', 'isolatingTransformerVa', 'rcdType', 'rcdRatedResidualMa', 'emergencyStop', 'nextInspectionOn', 'notes', 'active'] as const;
    const body: Record<string, unknown> = {};
    for (const k of keys) if (next[k] !== original[k]) body[k] = next[k];
    return body as BenchUpdateBody;
  });

  return { form, reset, createBody, changes };
}

function numberOrNull(v: unknown): number | null {
  return v === null || v === '' || v === undefined ? null : Number(v);
}
