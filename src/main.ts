import '@fontsource/roboto/latin-400.css';
import '@fontsource/roboto/latin-500.css';
import '@fontsource/roboto/latin-700.css';
import '@fontsource/roboto/latin-ext-400.css';
import '@fontsource/roboto/latin-ext-500.css';
import '@fontsource/roboto/latin-ext-700.css';
import './assets/main.css';

import { createApp } from 'vue';
import { createPinia } from 'pinia';
import { abilitiesPlugin } from '@casl/vue';
import App from './App.vue';
import { createAppRouter } from './router';
import { createAppVuetify } from './plugins/vuetify';
import { ability } from './plugins/ability';
import { setUnauthorizedHandler } from './api';
import { useSessionStore } from './stores/session';

const app = createApp(App);
const pinia = createPinia();
const router = createAppRouter();

app.use(pinia);
app.use(router);
app.use(createAppVuetify());
app.use(abilitiesPlugin, ability, { useGlobalProperties: true });

// The session lapsed or was ended elsewhere: forget it and ask for a fresh sign-in, then come back here.
setUnauthorizedHandler(() => {
  useSessionStore(pinia).setUser(null);
  const current = router.currentRoute.value;
  if (!current.meta.public) void router.push({ name: 'sign-in', query: { redirect: current.fullPath } });
});

app.mount('#app');
