import { ref, watch, type Ref } from 'vue';
import { PASSWORD_MIN } from '@shared/password-rules';

type Verdict = (password: string, context: string[]) => string | null;
let loading: Promise<Verdict> | null = null;
// The checker carries the common-password lists (about 1 MB), so it loads on the first keystroke, not with the page.
const load = () => (loading ??= import('@shared/password-verdict').then((m) => m.passwordVerdict));

/** The person's name and e-mail local part, as the server passes them to its check. */
export const passwordContext = (email: string, name: string) => [email.split('@')[0], ...name.split(/\s+/)];

/**
 * The server's verdict on a new password while it is typed (common, contains the name, easy to guess).
 * Shown only; the server still decides when the form is sent. Silent below the minimum length, where
 * the length rule already speaks.
 */
export function usePasswordVerdict(password: Ref<string>, context: () => string[]) {
  const verdict = ref<string | null>(null);
  watch(password, async (value) => {
    if ([...(value ?? '').normalize('NFKC')].length < PASSWORD_MIN) {
      verdict.value = null;
      return;
    }
    const check = await load().catch(() => null);
    if (check && password.value === value) verdict.value = check(value, context());
  });
  return verdict;
}
