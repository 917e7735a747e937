import { computed, ref } from 'vue';
import { sitesApi, type Site } from '@/api';

// Sites change rarely; one list per page load is enough.
const sites = ref<Site[]>([]);
const loading = ref(false);
const error = ref('');
let pending: Promise<void> | null = null;

export function useSites() {
  function load(): Promise<void> {
    if (sites.value.length) return Promise.resolve();
    loading.value = true;
    pending ??= sitesApi
      .list()
      .then((list) => {
        sites.value = list;
        error.value = '';
      })
      .catch((e: Error) => {
        error.value = e.message;
      })
      .finally(() => {
        loading.value = false;
        pending = null;
      });
    return pending;
  }
  const byId = computed(() => new Map(sites.value.map((s) => [s.id, s])));
  const siteName = (id: string) => byId.value.get(id)?.name ?? (loading.value ? '…' : 'a site no longer listed');
  return { sites, loading, error, load, siteName };
}
