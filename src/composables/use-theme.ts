import { computed, ref, watch } from 'vue';
import { useOsTheme } from 'naive-ui';
import { parseThemePreference, resolveTheme, type ThemeName, type ThemePreference } from '@/lib/theme-choice';

const STORAGE_KEY = 'thermoledger.theme';

function readStored(): string | null {
  try {
    return localStorage.getItem(STORAGE_KEY);
  } catch {
    return null;
  }
}

// One preference for the whole app, shared by every caller.
const preference = ref<ThemePreference>(parseThemePreference(readStored()));
watch(preference, (value) => {
  try {
    if (value === 'system') localStorage.removeItem(STORAGE_KEY);
    else localStorage.setItem(STORAGE_KEY, value);
  } catch {
    // Storage unavailable: the choice lasts for this visit only.
  }
});

/** The theme on screen; follows the OS until the user picks one, then remembers the pick. */
export function useTheme() {
  const os = useOsTheme();
  const theme = computed<ThemeName>(() => resolveTheme(preference.value, os.value));
  function toggle(): void {
    preference.value = theme.value === 'dark' ? 'light' : 'dark';
  }
  return { theme, preference, toggle };
}
