import { computed, onMounted, ref, shallowRef, watch } from 'vue';
import { benchesApi, instrumentsApi, type BenchRow, type InstrumentRow } from '@/api';
import { proceduresApi, type ProcedureRowView, type VersionView } from '@/api/procedures';
import type { ScopeView } from '@shared/authorisations/views';
import { practicalsApi, type Candidate } from '@/api/records';

/** What an assessor chooses from when opening a practical: people they cover, benches, procedures in force, instruments. */
export function usePracticalSetup() {
  const technicians = shallowRef<Candidate[]>([]);
  const benches = shallowRef<BenchRow[]>([]);
  const procedures = shallowRef<ProcedureRowView[]>([]);
  const instruments = shallowRef<InstrumentRow[]>([]);
  const version = shallowRef<VersionView | null>(null);
  const allScopes = shallowRef<ScopeView[]>([]);
  const choice = ref({ technicianId: null as string | null, benchId: null as string | null, procedureId: null as string | null, checklistId: null as string | null, scopeId: null as string | null, instrumentIds: [] as string[] });
  const error = ref('');

  onMounted(async () => {
    try {
      const [t, b, p, sc] = await Promise.all([practicalsApi.technicians(), benchesApi.list({ active: 'true', pageSize: 200 }), proceduresApi.list({ pageSize: 200 }), practicalsApi.scopes()]);
      allScopes.value = sc;
      technicians.value = t.items;
      benches.value = b.items;
      procedures.value = p.items.filter((r) => r.publishedVersionId);
    } catch (e) {
      error.value = e instanceof Error ? e.message : String(e);
    }
  });
  const bench = computed(() => benches.value.find((b) => b.id === choice.value.benchId) ?? null);
  watch(() => choice.value.benchId, async () => {
    choice.value.instrumentIds = [];
    instruments.value = bench.value ? (await instrumentsApi.list({ siteId: bench.value.siteId, active: 'true', pageSize: 200 })).items : [];
  });
  watch(() => choice.value.procedureId, async (id) => {
    const row = procedures.value.find((p) => p.id === id);
    version.value = row?.publishedVersionId ? await proceduresApi.version(row.id, row.publishedVersionId) : null;
    choice.value.scopeId = null;
    choice.value.checklistId = version.value?.checklists.find((c) => c.kind === 'practical-assessment')?.id ?? null;
  });
  const checklists = computed(() => (version.value?.checklists ?? []).filter((c) => c.kind === 'practical-assessment'));
  // Scopes that count practicals on this procedure: naming one means the assessor must hold it today.
  const scopes = computed(() => allScopes.value.filter((sc) => sc.active && sc.requirements.some((r) => r.kind === 'practicals' && r.procedureId === choice.value.procedureId)));
  return { technicians, benches, procedures, instruments, version, checklists, scopes, bench, choice, error };
}
