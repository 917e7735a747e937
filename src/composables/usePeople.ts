import type { Role } from '@shared/roles';
import { peopleApi, type PeopleQuery } from '@/api';
import { usePagedTable } from './usePagedTable';

export type { TableOptions } from './usePagedTable';

export interface PeopleFilters {
  q: string;
  siteId: string | null;
  role: Role | null;
  active: 'true' | 'false' | null;
}

const SORTABLE: PeopleQuery['sort'][] = ['name', 'email', 'site', 'createdAt'];

/** One page of the people list, kept in step with the table's paging, sorting and the filters. */
export function usePeople() {
  return usePagedTable((query) => peopleApi.list(query as PeopleQuery), {
    filters: { q: '', siteId: null, role: null, active: null } as PeopleFilters,
    sortable: SORTABLE,
    sort: 'name',
  });
}
