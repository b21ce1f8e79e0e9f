/**
 * The drift plot of a calorimeter run: the readings, the fore- and after-period drift lines drawn
 * out to the Dickinson time t_m (or across the main period for Regnault–Pfaundler), t_m marked,
 * and the corrected ΔT drawn as the gap between the two lines at t_m. Pure: returns the ECharts
 * option; temperatures in K, times in s.
 */
import type { DriftReply } from '@shared/schemas/calorimetry';
import type { PlotOption } from '@/plugins/echarts';
import { axisStyle, baseStyle, type ChartColors } from './chart-style';
import { formatSignificant } from './uncertainty-rounding';

type Line = DriftReply['fore'];

const lineAt = (line: Line, t: number) => line.anchor.temperature + line.slope * (t - line.anchor.time);

/** K from a reading on the scale. */
export function readingInKelvin(value: number, unit: 'K' | 'C' | 'F'): number {
  return unit === 'K' ? value : unit === 'C' ? value + 273.15 : ((value + 459.67) * 5) / 9;
}

export function driftPlotOption(args: {
  series: readonly (readonly [number, number])[];
  drift: DriftReply;
  colors: ChartColors;
}): PlotOption {
  const { drift: d, colors: c } = args;
  const joinFore = d.tMid ?? d.mainPeriod.end;
  const joinAfter = d.tMid ?? d.mainPeriod.start;
  const marks =
    d.tMid === null
      ? []
      : [
          {
            name: `t_m = ${formatSignificant(d.tMid, 4)} s`,
            xAxis: d.tMid,
          },
        ];
  const gap =
    d.tMid === null
      ? []
      : [
          [
            {
              coord: [d.tMid, lineAt(d.fore, d.tMid)],
              name: `corrected ΔT = ${formatSignificant(d.correctedDeltaT, 4)} K`,
            },
            { coord: [d.tMid, lineAt(d.after, d.tMid)] },
          ],
        ];
  return {
    ...baseStyle(c),
    tooltip: {
      ...baseStyle(c).tooltip,
      valueFormatter: (v: unknown) => (typeof v === 'number' ? `${formatSignificant(v, 6)} K` : '—'),
    },
    grid: { left: 70, right: 28, top: 30, bottom: 50, containLabel: false },
    xAxis: { type: 'value', scale: true, ...axisStyle(c, 't / s'), nameGap: 30 },
    yAxis: { type: 'value', scale: true, ...axisStyle(c, 'T / K'), nameGap: 52 },
    series: [
      {
        type: 'line',
        name: 'Readings',
        data: args.series.map(([t, T]) => [t, T]),
        showSymbol: args.series.length <= 80,
        symbolSize: 4,
        lineStyle: { width: 1.5 },
        markLine: {
          symbol: 'none',
          silent: true,
          lineStyle: { color: c.warning, type: 'dashed', width: 1.2 },
          label: {
            color: c.muted,
            fontSize: 11,
            formatter: (p: { name?: string }) => p.name ?? '',
            position: 'insideEndTop',
          },
          data: [...marks, ...gap] as never,
        },
      },
      {
        type: 'line',
        name: 'Fore-period drift',
        data: [
          [d.fore.from, lineAt(d.fore, d.fore.from)],
          [joinFore, lineAt(d.fore, joinFore)],
        ],
        showSymbol: false,
        lineStyle: { width: 1.5, type: 'dashed' },
      },
      {
        type: 'line',
        name: 'After-period drift',
        data: [
          [joinAfter, lineAt(d.after, joinAfter)],
          [d.after.to, lineAt(d.after, d.after.to)],
        ],
        showSymbol: false,
        lineStyle: { width: 1.5, type: 'dashed' },
      },
    ],
  };
}

/** The plot in words, for its caption. */
export function driftPlotSummary(d: DriftReply): string {
  const method =
    d.method === 'dickinson' ? 'Dickinson’s equal-area extrapolation' : 'the Regnault–Pfaundler correction';
  const where =
    d.tMid === null
      ? ''
      : ` Both drift lines are extrapolated to t_m = ${formatSignificant(d.tMid, 4)} s, where ${formatSignificant((d.riseFractionAtTMid ?? 0) * 100, 3)} % of the rise is reached.`;
  return `Observed rise ${formatSignificant(d.observedDeltaT, 4)} K; corrected by ${method} to ${formatSignificant(d.correctedDeltaT, 4)} K. Main period ${formatSignificant(d.mainPeriod.start, 4)}–${formatSignificant(d.mainPeriod.end, 4)} s.${where}`;
}
