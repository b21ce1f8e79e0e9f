import { createRouter, createWebHistory, type RouteLocationNormalized } from 'vue-router';
import { useSessionStore } from '@/stores/session';
import { guardNavigation, type GuardTarget } from './guard';
import { routes } from './routes';

export const router = createRouter({
  history: createWebHistory(import.meta.env.BASE_URL),
  routes,
  scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
});

router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.ensureLoaded();
  const outcome = guardNavigation(guardTargetOf(to), session.info);
  // 'forbidden' proceeds: the page keeps its address and the layout shows the not-allowed view.
  if (outcome.kind === 'redirect') return outcome.to;
  return true;
});

/** The guard's inputs for a resolved route (also used by the layout to react to sign-out). */
export function guardTargetOf(to: RouteLocationNormalized): GuardTarget {
  const teamId = typeof to.params.teamId === 'string' ? to.params.teamId : undefined;
  return { fullPath: to.fullPath, access: to.meta.access, guestOnly: to.meta.guestOnly === true, teamId };
}

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Thermoledger` : 'Thermoledger';
});
