import { ref } from 'vue';

// Shared by the drawer and the top bar's menu button; null lets Vuetify choose by screen width.
const open = ref<boolean | null>(null);

export function useNavigationDrawer() {
  const toggle = () => {
    open.value = !open.value;
  };
  return { open, toggle };
}
