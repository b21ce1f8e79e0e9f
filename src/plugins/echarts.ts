/**
 * ECharts with only the parts our plots use (line charts, axes, tooltips, marked lines and areas,
 * ARIA text), so the plot chunk stays small. The canvas draws on screen; the SVG renderer
 * is there for saving a plot as SVG.
 */
import { init, use, type ComposeOption } from 'echarts/core';
import { CanvasRenderer, SVGRenderer } from 'echarts/renderers';
import { LineChart, type LineSeriesOption } from 'echarts/charts';
import {
  AriaComponent,
  GridComponent,
  MarkAreaComponent,
  MarkLineComponent,
  TooltipComponent,
  type AriaComponentOption,
  type GridComponentOption,
  type MarkAreaComponentOption,
  type MarkLineComponentOption,
  type TooltipComponentOption,
} from 'echarts/components';

use([
  CanvasRenderer,
  SVGRenderer,
  LineChart,
  GridComponent,
  TooltipComponent,
  MarkLineComponent,
  MarkAreaComponent,
  AriaComponent,
]);

/** The option type of the parts registered above. */
export type PlotOption = ComposeOption<
  | LineSeriesOption
  | GridComponentOption
  | TooltipComponentOption
  | MarkLineComponentOption
  | MarkAreaComponentOption
  | AriaComponentOption
>;

/** The same plot drawn as an SVG document (server-side-style rendering, no DOM needed). */
export function plotToSvg(option: PlotOption, width: number, height: number): string {
  const chart = init(null, null, { renderer: 'svg', ssr: true, width, height });
  try {
    chart.setOption({ ...option, animation: false });
    return chart.renderToSVGString();
  } finally {
    chart.dispose();
  }
}
