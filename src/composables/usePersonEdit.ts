import { computed, reactive, ref } from 'vue';
import type { Role } from '@shared/roles';
import { peopleApi, type Person, type UpdatePersonBody } from '@/api';

const sameSet = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((x) => b.includes(x));

/** Loads one person for editing and works out which fields changed, so only those are sent. */
export function usePersonEdit() {
  const person = ref<Person | null>(null);
  const loading = ref(false);
  const loadError = ref('');
  const form = reactive({ name: '', siteId: null as string | null, roles: [] as Role[], coveredSiteIds: [] as string[], accessEndsOn: '', active: true, reason: '' });

  async function load(id: string) {
    loading.value = true;
    loadError.value = '';
    person.value = null;
    try {
      const p = await peopleApi.get(id);
      person.value = p;
      Object.assign(form, {
        name: p.name, siteId: p.siteId, roles: [...p.roles], coveredSiteIds: p.coveredSiteIds.filter((s) => s !== p.siteId),
        accessEndsOn: p.accessEndsOn ?? '', active: p.active, reason: '',
      });
    } catch (e) {
      loadError.value = e instanceof Error ? e.message : String(e);
    } finally {
      loading.value = false;
    }
  }

  const changes = computed<UpdatePersonBody>(() => {
    const p = person.value;
    if (!p) return {};
    const body: UpdatePersonBody = {};
    if (form.name.trim() !== p.name) body.name = form.name;
    if (form.siteId && form.siteId !== p.siteId) body.siteId = form.siteId;
    if (!sameSet(form.roles, p.roles)) body.roles = form.roles;
    const covered = form.roles.some((r) => r === 'assessor' || r === 'manager') ? form.coveredSiteIds : [];
    if (!sameSet(covered, p.coveredSiteIds.filter((s) => s !== p.siteId))) body.coveredSiteIds = covered;
    if ((form.accessEndsOn || null) !== p.accessEndsOn) body.accessEndsOn = form.accessEndsOn || null;
    if (form.active !== p.active) {
      body.active = form.active;
      if (!form.active) body.deactivatedReason = form.reason;
    }
    return body;
  });

  return { person, loading, loadError, form, load, changes };
}
