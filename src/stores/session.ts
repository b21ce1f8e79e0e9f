import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { SessionInfo, SignInInput } from '@shared/schemas/session';
import * as sessionApi from '@/api/session';
import { isApiError } from '@/api/api-error';

const anonymous: SessionInfo = { user: null, teams: [], via: 'none' };

/** Who is signed in. Loaded once before the first navigation, refreshed after sign-in/out. */
export const useSessionStore = defineStore('session', () => {
  const info = ref<SessionInfo>(anonymous);
  const loaded = ref(false);
  /** Set when the session could not be read (server down): the app then runs signed out. */
  const loadError = ref<string | null>(null);
  let loading: Promise<void> | null = null;

  const user = computed(() => info.value.user);
  const teams = computed(() => info.value.teams);
  const signedIn = computed(() => info.value.user !== null);
  const isSiteAdmin = computed(() => info.value.user?.siteRoles.includes('site_admin') ?? false);

  async function refresh(): Promise<void> {
    try {
      info.value = await sessionApi.getSession();
      loadError.value = null;
    } catch (error) {
      info.value = anonymous;
      loadError.value = isApiError(error) ? error.message : 'Could not read the session.';
    } finally {
      loaded.value = true;
    }
  }

  /** Resolves once the session has been read at least once. */
  function ensureLoaded(): Promise<void> {
    if (loaded.value) return Promise.resolve();
    loading ??= refresh();
    return loading;
  }

  /** Signs in; rejects with the server's ApiError (wrong password, rate limit…). */
  async function signIn(input: SignInInput): Promise<void> {
    info.value = await sessionApi.signIn(input);
    loaded.value = true;
  }

  async function signOut(): Promise<void> {
    try {
      await sessionApi.signOut();
    } finally {
      info.value = anonymous;
    }
  }

  /** Takes a session returned by another call (accepting an invitation signs in). */
  function adopt(next: SessionInfo): void {
    info.value = next;
    loaded.value = true;
  }

  return { info, loaded, loadError, user, teams, signedIn, isSiteAdmin, refresh, ensureLoaded, signIn, signOut, adopt };
});
