import { computed, reactive, ref, watch, type Ref } from 'vue';
import { minimumChangeClass, isAtLeast } from '@shared/procedures/change-class';
import type { AcceptanceRule, ChecklistKind, ItemKind } from '@shared/schemas/checklists';
import type { ChangeClass, ProcedureCategory } from '@shared/schemas/procedures';
import { isApiError } from '@/api';
import { proceduresApi, type SaveDraftInput, type VersionView } from '@/api/procedures';

export interface EditorStep { key: string; text: string; caution: string; holdPoint: boolean }
export interface EditorItem { key: string; kind: ItemKind; prompt: string; guidance: string; unit: string; rule: AcceptanceRule | null; stepKey: string | null }
export interface EditorChecklist { key: string; kind: ChecklistKind; title: string; items: EditorItem[] }
export interface DraftForm {
  title: string; category: ProcedureCategory; reviewPeriodMonths: number; scope: string;
  hazards: string[]; ppe: string[]; equipment: string[]; steps: EditorStep[]; checklists: EditorChecklist[];
  changeSummary: string; changeClass: ChangeClass | null; rereadDays: number;
}

export const newKey = () => crypto.randomUUID();

/** A new checklist item belongs to the step of the item before it, or to the first step when it is the first. */
export function newItem(steps: EditorStep[], before?: EditorItem): EditorItem {
  return { key: newKey(), kind: 'tick', prompt: '', guidance: '', unit: '', rule: null, stepKey: before ? before.stepKey : (steps[0]?.key ?? null) };
}

function formOf(v: VersionView): DraftForm {
  return {
    title: v.title, category: v.category, reviewPeriodMonths: v.reviewPeriodMonths, scope: v.scope,
    hazards: [...v.hazards], ppe: [...v.ppe], equipment: [...v.equipment],
    steps: v.steps.map((s) => ({ key: s.key, text: s.text, caution: s.caution ?? '', holdPoint: s.holdPoint })),
    checklists: v.checklists.map((c) => ({ key: c.key, kind: c.kind, title: c.title, items: c.items.map((i) => ({ key: i.key, kind: i.kind, prompt: i.prompt, guidance: i.guidance ?? '', unit: i.unit ?? '', rule: i.rule, stepKey: i.stepKey ?? null })) })),
    changeSummary: v.changeSummary ?? '', changeClass: v.changeClass, rereadDays: v.rereadDays,
  };
}

function bodyOf(f: DraftForm, first: boolean): SaveDraftInput {
  return {
    ...f, reviewPeriodMonths: Number(f.reviewPeriodMonths), rereadDays: Number(f.rereadDays),
    steps: f.steps.map((s) => ({ key: s.key, text: s.text, caution: s.caution || null, holdPoint: s.holdPoint })),
    checklists: f.checklists.map((c) => ({
      key: c.key, kind: c.kind, title: c.title,
      items: c.items.map((i) => (i.kind === 'measurement' ? { key: i.key, kind: i.kind, prompt: i.prompt, guidance: i.guidance || null, stepKey: i.stepKey, unit: i.unit, rule: i.rule! } : { key: i.key, kind: i.kind, prompt: i.prompt, guidance: i.guidance || null, stepKey: i.stepKey })),
    })) as SaveDraftInput['checklists'],
    changeSummary: first ? null : f.changeSummary || null, changeClass: first ? null : f.changeClass,
  };
}

/** The editor's state: the form, whether it differs from what was saved, save, and field messages by path. */
export function useProcedureDraft(version: Ref<VersionView | null>, baseSteps: Ref<{ key: string; holdPoint: boolean }[] | null>) {
  const form = reactive<DraftForm>({} as DraftForm);
  const saved = ref('');
  const errors = ref<Record<string, string>>({});
  const formError = ref('');
  const saving = ref(false);
  watch(version, (v) => {
    if (!v) return;
    Object.assign(form, formOf(v));
    saved.value = JSON.stringify(form);
  }, { immediate: true });
  const dirty = computed(() => Boolean(version.value) && JSON.stringify(form) !== saved.value);
  const changeCheck = computed(() => (baseSteps.value ? minimumChangeClass(baseSteps.value, form.steps ?? []) : null));
  const classTooLow = computed(() => Boolean(changeCheck.value && form.changeClass && !isAtLeast(form.changeClass, changeCheck.value.minimum)));

  async function save() {
    if (!version.value) return;
    saving.value = true;
    errors.value = {};
    formError.value = '';
    try {
      version.value = await proceduresApi.save(version.value.procedureId, version.value.id, bodyOf(form, version.value.number === 1));
    } catch (e) {
      if (isApiError(e) && Object.keys(e.fields).length) errors.value = e.fields;
      formError.value = e instanceof Error ? e.message : String(e);
      throw e;
    } finally {
      saving.value = false;
    }
  }

  /** Vuetify error-messages for the field at `path` (as the server names it: steps.2.text). */
  const msg = (path: string) => (errors.value[path] ? [errors.value[path]] : []);
  return { form, dirty, save, saving, errors, formError, msg, changeCheck, classTooLow };
}

/** Moves entry i of a list one place up (-1) or down (+1). */
export function move<T>(list: T[], i: number, by: -1 | 1) {
  const j = i + by;
  if (j < 0 || j >= list.length) return;
  [list[i], list[j]] = [list[j], list[i]];
}
