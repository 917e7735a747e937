import { createRouter, createWebHistory, type Router, type RouterHistory } from 'vue-router';
import { ability } from '@/plugins/ability';
import { useSessionStore } from '@/stores/session';
import { useNotice } from '@/composables/useNotice';
import { routes } from './routes';

export function createAppRouter(history: RouterHistory = createWebHistory()): Router {
  const router = createRouter({ history, routes, scrollBehavior: () => ({ top: 0 }) });

  router.beforeEach(async (to) => {
    const session = useSessionStore();
    // A server that cannot be reached leaves nobody signed in; the sign-in form then says why.
    await session.ensureLoaded().catch(() => undefined);
    if (to.meta.public) return to.meta.guestOnly && session.user ? { name: 'home' } : true;
    if (!session.user) return { name: 'sign-in', query: to.fullPath === '/' ? {} : { redirect: to.fullPath } };
    if (to.meta.can && !ability.can(...to.meta.can)) {
      useNotice().show(`Your roles do not include “${to.meta.title}”.`, 'warning');
      return { name: 'home' };
    }
    return true;
  });

  router.afterEach((to) => {
    document.title = to.meta.title ? `${to.meta.title} · Breakover` : 'Breakover';
  });

  return router;
}
