import { ref } from 'vue';

export type NoticeColor = 'success' | 'info' | 'warning' | 'error';

// Module-level so a guard, a dialog and the snackbar in App.vue share one notice.
const text = ref('');
const color = ref<NoticeColor>('success');
const visible = ref(false);

/** A short message after an action ("Invitation sent"), shown by AppNotice.vue. */
export function useNotice() {
  function show(message: string, tone: NoticeColor = 'success') {
    text.value = message;
    color.value = tone;
    visible.value = true;
  }
  return { text, color, visible, show };
}
