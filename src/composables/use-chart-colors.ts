import { computed, type ComputedRef } from 'vue';
import { useThemeVars } from 'naive-ui';
import type { ChartColors } from '@/lib/chart-style';

/** The plot colours of the current theme (light paper or dark slate). Call inside setup. */
export function useChartColors(): ComputedRef<ChartColors> {
  const vars = useThemeVars();
  return computed(() => ({
    text: vars.value.textColor1,
    muted: vars.value.textColor3,
    divider: vars.value.dividerColor,
    accent: vars.value.primaryColor,
    warning: vars.value.warningColor,
    card: vars.value.cardColor,
  }));
}
