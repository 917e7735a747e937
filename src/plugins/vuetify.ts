import 'vuetify/styles';
import { createVuetify, type ThemeDefinition } from 'vuetify';
import { aliases, mdi } from 'vuetify/iconsets/mdi-svg';

// A plain, high-contrast look for a workshop screen: warm paper, slate ink, amber for what matters.
const breakover: ThemeDefinition = {
  dark: false,
  colors: {
    background: '#f6f5f1',
    surface: '#ffffff',
    'surface-variant': '#e7e5df',
    primary: '#9a4a05',
    secondary: '#334155',
    accent: '#f59e0b',
    error: '#b3261e',
    warning: '#8a5a00',
    info: '#1d4f91',
    success: '#1f6b3a',
    slate: '#1e293b',
  },
};

// The navigation rail and the caution panel: slate with an amber highlight.
const breakoverSlate: ThemeDefinition = {
  dark: true,
  colors: {
    background: '#0f172a',
    surface: '#1e293b',
    primary: '#fbbf24',
    secondary: '#cbd5e1',
    error: '#f87171',
  },
};

export function createAppVuetify() {
  return createVuetify({
    icons: { defaultSet: 'mdi', aliases, sets: { mdi } },
    theme: { defaultTheme: 'breakover', themes: { breakover, breakoverSlate } },
    defaults: {
      VTextField: { variant: 'outlined', density: 'comfortable' },
      VSelect: { variant: 'outlined', density: 'comfortable' },
      VAutocomplete: { variant: 'outlined', density: 'comfortable' },
      VTextarea: { variant: 'outlined', density: 'comfortable' },
      VCard: { rounded: 'lg', variant: 'flat', border: true },
      VBtn: { rounded: 'md' },
    },
  });
}
