import { ref, watch, type Ref } from 'vue';
import { proceduresApi, type ProcedureView, type VersionView } from '@/api/procedures';

/** One version and its procedure (history, the version in force), reloaded when the route changes. */
export function useProcedureVersion(id: Ref<string>, versionId: Ref<string>) {
  const version = ref<VersionView | null>(null);
  const procedure = ref<ProcedureView | null>(null);
  const error = ref('');

  async function load() {
    error.value = '';
    try {
      [version.value, procedure.value] = await Promise.all([proceduresApi.version(id.value, versionId.value), proceduresApi.get(id.value)]);
    } catch (e) {
      version.value = null;
      error.value = e instanceof Error ? e.message : String(e);
    }
  }

  async function replaced(next: VersionView) {
    version.value = next;
    procedure.value = await proceduresApi.get(id.value);
  }

  watch([id, versionId], load, { immediate: true });
  return { version, procedure, error, load, replaced };
}
