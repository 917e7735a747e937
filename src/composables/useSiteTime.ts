import { computed } from 'vue';
import { formatInZone } from '@shared/time';
import { useSessionStore } from '@/stores/session';

/** Dates and times in the time zone of the viewer's own site. */
export function useSiteTime() {
  const session = useSessionStore();
  const timeZone = computed(() => session.user?.site.timeZone ?? 'UTC');
  const formatTime = (at: string | Date | null | undefined) => (at ? formatInZone(at, timeZone.value) : '—');
  return { timeZone, formatTime };
}
