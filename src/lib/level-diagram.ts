/**
 * The geometry of an enthalpy level diagram of one Hess route, from its steps: the running total
 * after each step is a level (a horizontal bar), each step an arrow from the level before to the
 * level after it, labelled with its scaled ΔH, and the target's overall ΔH a separate arrow from
 * the start to the end. Levels read left to right; higher enthalpy is higher up. Pure numbers in
 * SVG user units, so the drawing and the tests share them.
 */

export interface DiagramStep {
  /** multiplier × ΔH of the step's reaction, kJ/mol. */
  deltaH: number;
}

export interface DiagramLevel {
  /** 0 for the start, then the step after which this level is reached (1-based). */
  index: number;
  /** Σ of the scaled ΔH of steps 1..index, kJ/mol (0 at the start). */
  enthalpy: number;
  x1: number;
  x2: number;
  y: number;
  /** Where its figure starts (above the bar, just right of the arrow that reaches it). */
  labelX: number;
}

export interface DiagramArrow {
  /** The step (1-based), or 0 for the overall arrow. */
  step: number;
  deltaH: number;
  x: number;
  /** From the level before (y1) to the level after (y2). */
  y1: number;
  y2: number;
  /** Where the level before ends (a dashed guide runs from there to the arrow's foot). */
  guideFromX: number;
}

export interface LevelDiagram {
  width: number;
  height: number;
  levels: DiagramLevel[];
  arrows: DiagramArrow[];
  overall: DiagramArrow;
  /** The top and bottom of the enthalpy scale shown, kJ/mol. */
  range: { min: number; max: number };
  /** y of the zero line (the start). */
  zeroY: number;
}

export interface DiagramLayout {
  width?: number;
  height?: number;
  /** Room around the plot for labels. */
  margin?: { top: number; right: number; bottom: number; left: number };
}

/** Running totals: 0, s1, s1 + s2, … Added in order, as the route total is. */
export function cumulativeEnthalpies(steps: readonly DiagramStep[]): number[] {
  const out = [0];
  let sum = 0;
  for (const step of steps) {
    sum += step.deltaH;
    out.push(sum);
  }
  return out;
}

/**
 * Lays out the diagram of a route. Column 0 holds the start level; column i the arrow of step i
 * and the level it reaches; the last column the overall arrow beside the final level, which
 * extends into it. With no steps there is nothing to draw (one level, a zero arrow).
 */
export function levelDiagram(steps: readonly DiagramStep[], layout: DiagramLayout = {}): LevelDiagram {
  const width = layout.width ?? 760;
  const height = layout.height ?? 340;
  const margin = layout.margin ?? { top: 34, right: 24, bottom: 30, left: 24 };
  const totals = cumulativeEnthalpies(steps);
  let min = Math.min(...totals);
  let max = Math.max(...totals);
  if (max - min < 1e-9) {
    // All levels at one height: give the scale some room around it.
    min -= 1;
    max += 1;
  }
  const plotTop = margin.top;
  const plotBottom = height - margin.bottom;
  const y = (h: number) => plotTop + ((max - h) / (max - min)) * (plotBottom - plotTop);

  const columns = steps.length + 2;
  const columnWidth = (width - margin.left - margin.right) / columns;
  const columnStart = (i: number) => margin.left + i * columnWidth;
  const inset = Math.min(10, columnWidth * 0.08);
  const arrowOffset = Math.min(22, columnWidth * 0.18);

  const levels: DiagramLevel[] = totals.map((enthalpy, index) => {
    const x1 = columnStart(index) + (index === 0 ? inset : arrowOffset);
    const ownEnd = columnStart(index + 1) - inset;
    return {
      index,
      enthalpy,
      x1,
      // The final level runs on under the overall arrow's column.
      x2: index === steps.length ? columnStart(index + 1) + columnWidth - inset : ownEnd,
      y: y(enthalpy),
      labelX: index === 0 ? x1 : x1 + 6,
    };
  });
  const arrows: DiagramArrow[] = steps.map((step, i) => ({
    step: i + 1,
    deltaH: step.deltaH,
    x: columnStart(i + 1) + arrowOffset,
    y1: levels[i]!.y,
    y2: levels[i + 1]!.y,
    guideFromX: levels[i]!.x2,
  }));
  const total = totals[totals.length - 1]!;
  const overall: DiagramArrow = {
    step: 0,
    deltaH: total,
    x: columnStart(columns - 1) + columnWidth / 2,
    y1: y(0),
    y2: y(total),
    guideFromX: levels[0]!.x2,
  };
  return { width, height, levels, arrows, overall, range: { min, max }, zeroY: y(0) };
}

/** A step as the summary names it. */
export interface SummaryStep {
  equation: string;
  /** The multiplier as plain text ("−1", "1/2"). */
  multiplier: string;
  deltaH: number;
}

/**
 * The diagram in words, for screen readers and anyone who cannot see it: each step's scaled ΔH
 * and the level it reaches, then the target's ΔH. `format` writes a figure (kJ/mol, signed).
 */
export function levelSummary(
  routeNumber: number,
  steps: readonly SummaryStep[],
  format: (value: number, signed: boolean) => string,
): string {
  const totals = cumulativeEnthalpies(steps);
  const parts = steps.map(
    (s, i) =>
      `step ${i + 1} (${s.equation}, × ${s.multiplier}) ${format(s.deltaH, true)} kJ/mol, to ${format(totals[i + 1]!, false)}`,
  );
  const total = totals[totals.length - 1]!;
  return `Enthalpy levels of route ${routeNumber}, in kJ/mol relative to the target's reactants: start at 0; ${parts.join('; ')}. The target's ΔH, from the start to the last level, is ${format(total, false)} kJ/mol.`;
}
