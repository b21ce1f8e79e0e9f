/** Light or dark: an explicit choice wins, otherwise the operating system's setting. Pure. */
export type ThemeName = 'light' | 'dark';
export type ThemePreference = ThemeName | 'system';

/** The theme to show for a stored preference and the OS setting (null when the OS says nothing). */
export function resolveTheme(preference: ThemePreference, os: ThemeName | null): ThemeName {
  if (preference === 'light' || preference === 'dark') return preference;
  return os ?? 'light';
}

/** Reads a stored preference, treating anything unknown as "follow the system". */
export function parseThemePreference(stored: string | null): ThemePreference {
  return stored === 'light' || stored === 'dark' ? stored : 'system';
}
