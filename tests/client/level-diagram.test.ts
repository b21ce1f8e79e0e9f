import { describe, expect, it } from 'vitest';
import { cumulativeEnthalpies, levelDiagram, levelSummary } from '@/lib/level-diagram';

// The cycle for ΔfH°(CO, g): C(graphite) + O2 → CO2 at −393.51 kJ/mol, then CO2 → CO + 1/2 O2 at
// +282.98 kJ/mol (the combustion of CO reversed). Combustion values: CODATA Key Values for
// Thermodynamics (Cox, Wagman and Medvedev, 1989), ΔfH°(CO2, g) = −393.51 and ΔfH°(CO, g) = −110.53.
const coCycle = [{ deltaH: -393.51 }, { deltaH: 282.98 }];

describe('cumulativeEnthalpies', () => {
  it('starts at 0 and adds each step in turn', () => {
    const totals = cumulativeEnthalpies(coCycle);
    expect(totals).toHaveLength(3);
    expect(totals[0]).toBe(0);
    expect(totals[1]).toBe(-393.51);
    // −393.51 + 282.98 = −110.53, the ΔfH° of CO(g) in the CODATA Key Values.
    expect(totals[2]).toBeCloseTo(-110.53, 10);
  });

  it('is the start alone for no steps', () => {
    expect(cumulativeEnthalpies([])).toEqual([0]);
  });
});

describe('levelDiagram', () => {
  const layout = { width: 800, height: 400, margin: { top: 40, right: 20, bottom: 40, left: 20 } };

  it('puts the highest level at the top of the plot and the lowest at the bottom', () => {
    const d = levelDiagram(coCycle, layout);
    expect(d.levels.map((l) => l.index)).toEqual([0, 1, 2]);
    expect(d.levels[0]!.y).toBe(40); // 0 is the highest level
    expect(d.levels[1]!.y).toBe(360); // −393.51 the lowest
    // −110.53 lies 110.53/393.51 of the way down the 320 units of the plot.
    expect(d.levels[2]!.y).toBeCloseTo(40 + (110.53 / 393.51) * 320, 6);
    expect(d.zeroY).toBe(40);
    expect(d.range).toEqual({ min: -393.51, max: 0 });
  });

  it('draws each step from the level before to the level after, left to right, inside the width', () => {
    const d = levelDiagram(coCycle, layout);
    expect(d.arrows.map((a) => [a.step, a.y1, a.y2])).toEqual([
      [1, d.levels[0]!.y, d.levels[1]!.y],
      [2, d.levels[1]!.y, d.levels[2]!.y],
    ]);
    expect(d.arrows[0]!.x).toBeLessThan(d.arrows[1]!.x);
    expect(d.arrows[1]!.x).toBeLessThan(d.overall.x);
    for (const level of d.levels) {
      expect(level.x1).toBeLessThan(level.x2);
      expect(level.x1).toBeGreaterThanOrEqual(20);
      expect(level.x2).toBeLessThanOrEqual(780);
    }
    // Figures start on their bar, right of the arrow that reaches it.
    expect(d.levels.map((l) => l.labelX)).toEqual(d.levels.map((l, i) => (i === 0 ? l.x1 : d.arrows[i - 1]!.x + 6)));
    // A step's arrow stands on its own level's bar, past where the level before ends.
    for (const arrow of d.arrows) {
      const reached = d.levels[arrow.step]!;
      expect(arrow.x).toBeGreaterThanOrEqual(arrow.guideFromX);
      expect(arrow.x).toBeLessThanOrEqual(reached.x2);
    }
  });

  it('runs the overall arrow from the start to the last level, beside it', () => {
    const d = levelDiagram(coCycle, layout);
    expect(d.overall.step).toBe(0);
    expect(d.overall.deltaH).toBeCloseTo(-110.53, 10);
    expect(d.overall.y1).toBe(d.zeroY);
    expect(d.overall.y2).toBe(d.levels[2]!.y);
    const last = d.levels[2]!;
    expect(d.overall.x).toBeGreaterThan(last.x1);
    expect(d.overall.x).toBeLessThan(last.x2);
  });

  it('gives a flat cycle some height instead of dividing by zero', () => {
    const d = levelDiagram([{ deltaH: 5 }, { deltaH: -5 }], layout);
    expect(d.range).toEqual({ min: 0, max: 5 });
    const flat = levelDiagram([], layout);
    expect(flat.range).toEqual({ min: -1, max: 1 });
    expect(flat.levels).toHaveLength(1);
    expect(Number.isFinite(flat.levels[0]!.y)).toBe(true);
    expect(flat.levels[0]!.y).toBe(200);
  });
});

describe('levelSummary', () => {
  it('says each step, the level it reaches and the target ΔH', () => {
    const text = levelSummary(
      1,
      [
        { equation: 'C(cr, graphite) + O2(g) → CO2(g)', multiplier: '1', deltaH: -393.51 },
        { equation: 'CO(g) + 1/2 O2(g) → CO2(g)', multiplier: '−1', deltaH: 282.98 },
      ],
      (v, signed) => `${signed && v > 0 ? '+' : ''}${v.toFixed(2)}`,
    );
    expect(text).toBe(
      "Enthalpy levels of route 1, in kJ/mol relative to the target's reactants: start at 0; " +
        'step 1 (C(cr, graphite) + O2(g) → CO2(g), × 1) -393.51 kJ/mol, to -393.51; ' +
        'step 2 (CO(g) + 1/2 O2(g) → CO2(g), × −1) +282.98 kJ/mol, to -110.53. ' +
        "The target's ΔH, from the start to the last level, is -110.53 kJ/mol.",
    );
  });
});
