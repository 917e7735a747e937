import { ref } from 'vue';
import { isApiError } from '@/api';

/**
 * Server errors for one form: `fields` messages go beside the inputs the form has,
 * anything else becomes the form's alert.
 */
export function useFormErrors<F extends string>(known: readonly F[]) {
  const fieldErrors = ref<Partial<Record<F, string>>>({});
  const formError = ref('');
  const errorCode = ref('');

  function clear() {
    fieldErrors.value = {};
    formError.value = '';
    errorCode.value = '';
  }

  function capture(e: unknown) {
    clear();
    if (!isApiError(e)) {
      formError.value = e instanceof Error ? e.message : 'Something went wrong.';
      return;
    }
    errorCode.value = e.code;
    const matched: Partial<Record<F, string>> = {};
    for (const [key, message] of Object.entries(e.fields)) {
      const field = known.find((k) => key === k || key.startsWith(`${k}.`));
      if (field && !matched[field]) matched[field] = message;
    }
    fieldErrors.value = matched;
    if (Object.keys(matched).length === 0) formError.value = e.message;
  }

  /** Vuetify's `error-messages` for one input. */
  const messagesFor = (field: F): string[] => (fieldErrors.value[field] ? [fieldErrors.value[field] as string] : []);

  return { fieldErrors, formError, errorCode, capture, clear, messagesFor };
}
