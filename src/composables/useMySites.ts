import { computed, onMounted } from 'vue';
import { useSessionStore } from '@/stores/session';
import { useSites } from './useSites';

/** Site choices for lists and forms: every site for auditors and admins, otherwise the person's own sites. */
export function useMySites() {
  const session = useSessionStore();
  const { sites, load, siteName } = useSites();
  const seesAll = computed(() => Boolean(session.user?.roles.some((r) => r === 'auditor' || r === 'admin')));
  const options = computed(() =>
    sites.value.filter((s) => seesAll.value || session.user?.siteIds.includes(s.id)).map((s) => ({ title: `${s.name} (${s.code})`, value: s.id })),
  );
  onMounted(load);
  return { options, siteName };
}
