import { reactive, ref, shallowRef, watch } from 'vue';
import type { Page } from '@shared/schemas/common';

const SEARCH_DELAY_MS = 300;

export interface TableOptions {
  page: number;
  itemsPerPage: number;
  sortBy: readonly { key: string; order?: boolean | 'asc' | 'desc' }[];
}

/**
 * One server page of a list, kept in step with a v-data-table-server's paging and sorting and a set of
 * filters (a `q` filter is debounced). `fetch` receives page, pageSize, sort, dir and the filters.
 */
export function usePagedTable<T, F extends { q: string }, S extends string>(
  fetch: (query: Record<string, unknown>) => Promise<Page<T>>,
  opts: { filters: F; sortable: readonly S[]; sort: S },
) {
  const items = shallowRef<T[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const error = ref('');
  const options = reactive<TableOptions>({ page: 1, itemsPerPage: 25, sortBy: [{ key: opts.sort, order: 'asc' }] });
  const filters = reactive(opts.filters) as F;
  let latest = 0;

  async function load() {
    const mine = ++latest; // a slow answer to an older query must not overwrite a newer one
    loading.value = true;
    const sort = options.sortBy[0];
    const cleaned = Object.fromEntries(Object.entries(filters).map(([k, v]) => [k, typeof v === 'string' ? v.trim() || undefined : v ?? undefined]));
    try {
      const page = await fetch({
        ...cleaned, page: options.page, pageSize: options.itemsPerPage,
        sort: opts.sortable.find((k) => k === sort?.key) ?? opts.sort, dir: sort?.order === 'desc' ? 'desc' : 'asc',
      });
      if (mine !== latest) return;
      items.value = page.items;
      total.value = page.total;
      error.value = '';
    } catch (e) {
      if (mine === latest) error.value = e instanceof Error ? e.message : String(e);
    } finally {
      if (mine === latest) loading.value = false;
    }
  }

  function setOptions(next: TableOptions) {
    Object.assign(options, { page: next.page, itemsPerPage: next.itemsPerPage, sortBy: next.sortBy });
    void load();
  }

  function firstPage() {
    options.page = 1;
    void load();
  }

  let timer: ReturnType<typeof setTimeout> | undefined;
  watch(() => filters.q, () => {
    clearTimeout(timer);
    timer = setTimeout(firstPage, SEARCH_DELAY_MS);
  });
  // Reads only the other filters' values, so typing in the search box waits for the debounce above.
  const others = Object.keys(opts.filters).filter((k) => k !== 'q') as (keyof F)[];
  watch(() => others.map((k) => filters[k]), firstPage);

  return { items, total, loading, error, options, filters, load, setOptions };
}
