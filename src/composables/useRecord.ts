import { ref, watch, type Ref } from 'vue';

/**
 * One record (a sign-off or a practical) loaded by id; every action returns the record as the server now
 * has it, which replaces the one shown, so the screen never drifts from what is stored.
 */
export function useRecord<T>(id: Ref<string>, load: (id: string) => Promise<T>) {
  const record = ref<T | null>(null) as Ref<T | null>;
  const error = ref('');

  async function reload() {
    error.value = '';
    try {
      record.value = await load(id.value);
    } catch (e) {
      record.value = null;
      error.value = e instanceof Error ? e.message : String(e);
    }
  }

  /** Runs an action and shows its result; errors go to the caller (forms show them beside their fields). */
  async function act(action: (id: string) => Promise<T>) {
    record.value = await action(id.value);
    return record.value;
  }

  watch(id, reload, { immediate: true });
  return { record, error, reload, act };
}
