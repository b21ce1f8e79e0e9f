import { computed } from 'vue';
import { createSharedComposable, useLocalStorage, usePreferredDark } from '@vueuse/core';
import { parseThemePreference, resolveTheme, type ThemeName, type ThemePreference } from '@/lib/theme-choice';

const STORAGE_KEY = 'thermoledger.theme';

/**
 * The theme on screen; follows the OS until the user picks one, then remembers the pick (and
 * follows a pick made in another tab). One instance for the whole app, shared by every caller.
 */
export const useTheme = createSharedComposable(() => {
  // useLocalStorage copes with storage being unavailable: the choice then lasts for this visit.
  const preference = useLocalStorage<ThemePreference>(STORAGE_KEY, 'system', {
    serializer: { read: parseThemePreference, write: (value) => value },
    writeDefaults: false,
  });
  const prefersDark = usePreferredDark();
  const theme = computed<ThemeName>(() => resolveTheme(preference.value, prefersDark.value ? 'dark' : 'light'));
  function toggle(): void {
    preference.value = theme.value === 'dark' ? 'light' : 'dark';
  }
  return { theme, preference, toggle };
});
