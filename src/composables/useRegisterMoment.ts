import { computed, ref, watch } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import { cachedFormat, localDate, zoneOffsetMs } from '@shared/time';
import type { RegisterView } from '@shared/register/kinds';
import { useSiteTime } from './useSiteTime';

/** A wall-clock date and time in `tz` as the instant it names (settled twice across a clock change). */
export function instantIn(date: string, time: string, tz: string): Date {
  const [y, m, d] = date.split('-').map(Number);
  const [hh, mm] = (time || '00:00').split(':').map(Number);
  const wall = Date.UTC(y, m - 1, d, hh, mm);
  let t = wall - zoneOffsetMs(new Date(wall), tz);
  t = wall - zoneOffsetMs(new Date(t), tz);
  return new Date(t);
}

const hhmm = (at: Date, tz: string) => cachedFormat('hhmm', 'en-GB', { timeZone: tz, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(at);

/**
 * The moment a register page stands for, kept in the address (?at=…&view=…) so it can be shared and survives
 * a reload. Entered as a date and time in the viewer's site zone; empty means now.
 */
export function useRegisterMoment() {
  const route = useRoute();
  const router = useRouter();
  const { timeZone } = useSiteTime();
  const fromRoute = typeof route.query.at === 'string' ? new Date(route.query.at) : null;
  const date = ref(fromRoute ? localDate(fromRoute, timeZone.value) : '');
  const time = ref(fromRoute ? hhmm(fromRoute, timeZone.value) : '12:00');
  const view = ref<RegisterView>(route.query.view === 'known' ? 'known' : 'effective');
  const at = computed(() => (date.value ? instantIn(date.value, time.value, timeZone.value).toISOString() : undefined));

  watch([at, view], () => {
    void router.replace({ query: { ...route.query, at: at.value, view: at.value && view.value === 'known' ? 'known' : undefined } });
  });
  const reset = () => {
    date.value = '';
  };
  return { date, time, view, at, timeZone, reset, query: computed(() => ({ at: at.value, view: at.value ? view.value : undefined })) };
}
