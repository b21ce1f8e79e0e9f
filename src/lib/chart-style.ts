/**
 * Our plots' look from the theme's colours: paper or slate background, deep teal lines, quiet
 * axes, IBM Plex type. Pure: takes the colours, returns ECharts option pieces.
 */

export interface ChartColors {
  text: string;
  muted: string;
  divider: string;
  accent: string;
  warning: string;
  card: string;
}

/** Line colours in order: the theme's teal, then an ink blue and an ochre that stay apart in grey. */
export function seriesColors(c: ChartColors): string[] {
  return [c.accent, '#3d5a80', '#b5651d', '#6b4c9a'];
}

const sans = "'IBM Plex Sans', system-ui, sans-serif";

/** Axis styling shared by every plot. */
export function axisStyle(c: ChartColors, name: string) {
  return {
    name,
    nameLocation: 'middle' as const,
    nameTextStyle: { color: c.muted, fontFamily: sans, fontSize: 12 },
    axisLine: { lineStyle: { color: c.divider } },
    axisTick: { lineStyle: { color: c.divider } },
    axisLabel: { color: c.muted, fontFamily: sans, fontSize: 11 },
    splitLine: { lineStyle: { color: c.divider, type: 'dashed' as const } },
  };
}

/** Text and tooltip styling shared by every plot. */
export function baseStyle(c: ChartColors) {
  return {
    color: seriesColors(c),
    textStyle: { fontFamily: sans, color: c.text },
    tooltip: {
      trigger: 'axis' as const,
      backgroundColor: c.card,
      borderColor: c.divider,
      textStyle: { color: c.text, fontFamily: sans, fontSize: 12 },
    },
    animation: false,
  };
}
