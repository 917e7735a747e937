import { reactive, ref, watch } from 'vue';
import type { Role } from '@shared/roles';
import { peopleApi, type PeopleQuery, type PersonRow } from '@/api';

export interface PeopleFilters {
  q: string;
  siteId: string | null;
  role: Role | null;
  active: 'true' | 'false' | null;
}

export interface TableOptions {
  page: number;
  itemsPerPage: number;
  sortBy: readonly { key: string; order?: boolean | 'asc' | 'desc' }[];
}

const SORTABLE: PeopleQuery['sort'][] = ['name', 'email', 'site', 'createdAt'];
const SEARCH_DELAY_MS = 300;

/** One page of the people list, kept in step with the table's paging, sorting and the filters. */
export function usePeople() {
  const items = ref<PersonRow[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const error = ref('');
  const options = reactive<TableOptions>({ page: 1, itemsPerPage: 25, sortBy: [{ key: 'name', order: 'asc' }] });
  const filters = reactive<PeopleFilters>({ q: '', siteId: null, role: null, active: null });
  let latest = 0;

  function query(): PeopleQuery {
    const sort = options.sortBy[0];
    const key = SORTABLE.find((k) => k === sort?.key) ?? 'name';
    return {
      page: options.page,
      pageSize: options.itemsPerPage,
      q: (filters.q ?? '').trim() || undefined,
      siteId: filters.siteId ?? undefined,
      role: filters.role ?? undefined,
      active: filters.active ?? undefined,
      sort: key,
      dir: sort?.order === 'desc' ? 'desc' : 'asc',
    };
  }

  async function load() {
    const mine = ++latest; // a slow answer to an older query must not overwrite a newer one
    loading.value = true;
    try {
      const page = await peopleApi.list(query());
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
  watch(() => [filters.siteId, filters.role, filters.active], firstPage);

  return { items, total, loading, error, options, filters, load, setOptions };
}
