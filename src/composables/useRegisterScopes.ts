import { computed, onMounted, shallowRef } from 'vue';
import type { ScopeView } from '@shared/authorisations/views';
import { api } from '@/api/client';

// The scopes change rarely; one list per page load is enough for the register's filters.
const scopes = shallowRef<ScopeView[]>([]);
let pending: Promise<void> | null = null;

export function useRegisterScopes() {
  onMounted(() => {
    if (scopes.value.length) return;
    pending ??= api.get<ScopeView[]>('/scopes').then((list) => {
      scopes.value = list;
    }).finally(() => {
      pending = null;
    });
  });
  const options = computed(() => scopes.value.map((s) => ({ title: `${s.code} · ${s.title}`, value: s.id })));
  return { scopes, options };
}
