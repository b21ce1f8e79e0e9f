/**
 * ECharts options of our plots, built from computed points and the theme's colours. Pure: no
 * chart is drawn here. T on the x axis in K.
 */
import type { PlotOption } from '@/plugins/echarts';
import { axisStyle, baseStyle, type ChartColors } from './chart-style';
import type { CurveMark, CurvePoint } from './thermo-curves';
import type { GapInterval } from './enthalpy-curve';
import { formatSignificant, formatTemperature } from './uncertainty-rounding';

const grid = { left: 70, right: 28, top: 30, bottom: 50, containLabel: false };

function valueFormatter(unit: string) {
  return (value: unknown) => (typeof value === 'number' ? `${formatSignificant(value, 5)} ${unit}` : '—');
}

function marksLine(marks: readonly CurveMark[], c: ChartColors) {
  return {
    symbol: 'none',
    silent: true,
    lineStyle: { color: c.warning, type: 'dashed' as const, width: 1.2 },
    label: {
      color: c.muted,
      fontSize: 11,
      formatter: (p: { name?: string }) => p.name ?? '',
      position: 'insideEndTop' as const,
    },
    data: marks.map((m) => ({
      xAxis: m.temperature,
      name: `${m.label} ${formatTemperature(m.temperature)} K`,
    })),
  };
}

/** One quantity of a species against T, with its phase changes and joints marked. */
export function speciesCurveOption(args: {
  points: readonly CurvePoint[];
  marks: readonly CurveMark[];
  range: { min: number; max: number };
  yName: string;
  unit: string;
  seriesName: string;
  colors: ChartColors;
}): PlotOption {
  const { colors: c } = args;
  return {
    ...baseStyle(c),
    tooltip: { ...baseStyle(c).tooltip, valueFormatter: valueFormatter(args.unit) },
    grid,
    xAxis: { type: 'value', min: args.range.min, max: args.range.max, ...axisStyle(c, 'T / K'), nameGap: 30 },
    yAxis: { type: 'value', scale: true, ...axisStyle(c, args.yName), nameGap: 52 },
    series: [
      {
        type: 'line',
        name: args.seriesName,
        data: args.points.map((p) => [p[0], p[1] ?? '-']),
        showSymbol: false,
        connectNulls: false,
        lineStyle: { width: 2 },
        markLine: marksLine(args.marks, c),
      },
    ],
  };
}

/** ΔrH°(T) from the API's curve, gaps shaded and named, the chosen temperature marked. */
export function reactionCurveOption(args: {
  /** Values and, as null, the temperatures without one (so the line breaks there). */
  points: readonly { temperature: number; value: number | null }[];
  gaps: readonly GapInterval[];
  range: { from: number; to: number };
  chosen: number | null;
  unit: string;
  colors: ChartColors;
}): PlotOption {
  const { colors: c } = args;
  return {
    ...baseStyle(c),
    tooltip: { ...baseStyle(c).tooltip, valueFormatter: valueFormatter(args.unit) },
    grid,
    xAxis: { type: 'value', min: args.range.from, max: args.range.to, ...axisStyle(c, 'T / K'), nameGap: 30 },
    yAxis: { type: 'value', scale: true, ...axisStyle(c, `ΔrH° / ${args.unit}`), nameGap: 56 },
    series: [
      {
        type: 'line',
        name: 'ΔrH°',
        data: args.points.map((p) => [p.temperature, p.value ?? '-']),
        showSymbol: args.points.filter((p) => p.value !== null).length < 12,
        connectNulls: false,
        lineStyle: { width: 2 },
        markArea: {
          silent: true,
          itemStyle: { color: c.divider, opacity: 0.55 },
          label: { color: c.muted, fontSize: 11, position: 'insideTop' as const },
          data: args.gaps.map((g) => [{ xAxis: g.from, name: 'no value' }, { xAxis: g.to }]),
        },
        markLine: {
          symbol: 'none',
          silent: true,
          lineStyle: { color: c.warning, type: 'dashed' as const },
          label: { color: c.muted, fontSize: 11, formatter: (p: { name?: string }) => p.name ?? '' },
          data: args.chosen !== null ? [{ xAxis: args.chosen, name: `T = ${formatTemperature(args.chosen)} K` }] : [],
        },
      },
    ],
  };
}
