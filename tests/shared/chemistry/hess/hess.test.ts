import Fraction from 'fraction.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  buildHessNetwork,
  combineRoutes,
  consistencyFit,
  deriveEnthalpy,
  findRoutes,
  type InputInfo,
  type KnownReaction,
  type RouteSearchOptions,
  type SignedTerm,
} from '@shared/chemistry/hess/index';

const F = (x: number | string) => new Fraction(x);
const options = (overrides: Partial<RouteSearchOptions> = {}): RouteSearchOptions => ({
  maxSteps: 6,
  maxRoutes: 10,
  maxExamined: 10_000,
  outOfTime: () => false,
  ...overrides,
});

/** A reaction from "species: coefficient" pairs, reactants negative. */
function reaction(
  id: string,
  kind: KnownReaction['kind'],
  terms: Record<string, number | string>,
  deltaH: string,
  uncertainty: number | null,
): KnownReaction {
  return {
    id,
    kind,
    equation: id,
    terms: Object.entries(terms).map(([species, c]) => ({ species, coefficient: F(c) })),
    deltaH: F(deltaH),
    uncertainty,
  };
}
const formation = (species: string, deltaH: string, u: number | null) =>
  reaction(`formation:${species}`, 'formation', { [species]: 1 }, deltaH, u);
const target = (terms: Record<string, number | string>): SignedTerm[] =>
  Object.entries(terms).map(([species, c]) => ({ species, coefficient: F(c) }));

function inputsOf(reactions: KnownReaction[]): Map<string, InputInfo> {
  return new Map(reactions.map((r) => [r.id, { id: r.id, label: r.equation, uncertainty: r.uncertainty }]));
}
const noSpeciesInfo = new Map();

describe('findRoutes — textbook Hess problems', () => {
  it('gives ΔfH°(CO) from the combustion enthalpies of graphite and CO', () => {
    // Atkins & de Paula, Physical Chemistry (Hess's law example; from memory): C(graphite) + O2 → CO2,
    // −393.5 kJ/mol; CO + ½O2 → CO2, −283.0 kJ/mol; so C + ½O2 → CO is −110.5 kJ/mol. Elements in their
    // reference states are left out of the combiner's space.
    const given = [
      reaction('given:0', 'given', { 'CO2(g)': 1 }, '-393.5', 0.1),
      reaction('given:1', 'given', { 'CO(g)': -1, 'CO2(g)': 1 }, '-283.0', 0.1),
    ];
    const network = buildHessNetwork(given, noSpeciesInfo);
    const result = findRoutes(network, target({ 'CO(g)': 1 }), inputsOf(given), options());
    expect(result.routes).toHaveLength(1);
    const route = result.routes[0]!;
    expect(route.deltaH.equals(F('-110.5'))).toBe(true);
    const steps = route.steps.map((s) => [s.reaction.id, s.multiplier.toFraction()]).sort();
    expect(steps).toEqual([
      ['given:0', '1'],
      ['given:1', '-1'],
    ]);
    // u = √(0.1² + 0.1²) for independent inputs (GUM 5.1.2).
    expect(route.uncertainty).toBeCloseTo(Math.SQRT2 * 0.1, 12);
  });

  it('gives ΔfH°(C3H8, g) from its combustion enthalpy, exactly', () => {
    // ΔcH°(C3H8, g) = −2219.9 kJ/mol (CRC Handbook, heats of combustion; from memory), with
    // ΔfH°(CO2, g) = −393.51 and ΔfH°(H2O, l) = −285.830 kJ/mol (CODATA 1989; from memory):
    // ΔfH° = 3(−393.51) + 4(−285.830) + 2219.9 = −103.95 kJ/mol exactly on these figures.
    const known = [
      formation('CO2(g)', '-393.51', 0.065),
      formation('H2O(l)', '-285.830', 0.02),
      reaction('measured:c3h8', 'measured', { 'C3H8(g)': -1, 'CO2(g)': 3, 'H2O(l)': 4 }, '-2219.9', 0.25),
    ];
    const network = buildHessNetwork(known, noSpeciesInfo);
    const result = findRoutes(network, target({ 'C3H8(g)': 1 }), inputsOf(known), options());
    expect(result.routes).toHaveLength(1);
    expect(result.routes[0]!.deltaH.equals(F('-103.95'))).toBe(true);
    expect(result.routes[0]!.steps.map((s) => s.reaction.id).sort()).toEqual([
      'formation:CO2(g)',
      'formation:H2O(l)',
      'measured:c3h8',
    ]);
  });

  it('finds the tabulated route and the independent route through measurements, and combines them', () => {
    // CO with a tabulated ΔfH° and the two combustions: two routes sharing nothing but CO2's value.
    const known = [
      formation('CO2(g)', '-393.51', 0.065),
      formation('CO(g)', '-110.53', 0.085),
      reaction('measured:co', 'measured', { 'CO(g)': -1, 'CO2(g)': 1 }, '-282.98', 0.12),
    ];
    const network = buildHessNetwork(known, noSpeciesInfo);
    const derivation = deriveEnthalpy(network, target({ 'CO(g)': 1 }), inputsOf(known), options());
    expect(derivation.routes).toHaveLength(2);
    expect(derivation.consistent).toBe(true);
    expect(derivation.basis).toBe('combined');
    // Inverse-variance weighted mean of two independent estimates (Taylor, An Introduction to Error
    // Analysis, 2nd ed., ch. 7; from memory), written out here.
    const a = { y: -110.53, u: 0.085 };
    const b = { y: -393.51 + 282.98, u: Math.hypot(0.065, 0.12) };
    const w = [1 / a.u ** 2, 1 / b.u ** 2];
    expect(derivation.deltaH).toBeCloseTo((w[0]! * a.y + w[1]! * b.y) / (w[0]! + w[1]!), 9);
    expect(derivation.uncertainty).toBeCloseTo(1 / Math.sqrt(w[0]! + w[1]!), 9);
  });

  it('says which species cannot be reached when no route exists', () => {
    const known = [formation('CO2(g)', '-393.51', 0.065)];
    const network = buildHessNetwork(known, noSpeciesInfo);
    const result = findRoutes(network, target({ 'C60(cr)': 1 }), inputsOf(known), options());
    expect(result.routes).toHaveLength(0);
    expect(result.unreachable).toEqual(['C60(cr)']);
  });

  it('counts an input shared by a derived value once', () => {
    // ΔfH°(X) in the library was itself derived from measurement m1; a route that uses both the
    // library value and m1 must see the shared input, not two independent ones.
    const m1 = reaction('measured:m1', 'measured', { 'X(g)': -1, 'CO2(g)': 1 }, '-100', 1);
    const fX: KnownReaction = {
      ...formation('X(g)', '-293.51', null),
      basis: [
        { input: 'formation:CO2(g)', weight: F(1) },
        { input: 'measured:m1', weight: F(-1) },
      ],
    };
    const known = [formation('CO2(g)', '-393.51', 0.1), fX, m1];
    const inputs = inputsOf(known);
    const network = buildHessNetwork(known, noSpeciesInfo);
    // Target: X(g) → CO2(g) (the m1 reaction itself) by the route formation(CO2) − formation(X).
    const result = findRoutes(network, target({ 'X(g)': -1, 'CO2(g)': 1 }), inputs, options());
    const viaFormation = result.routes.find((r) => r.steps.every((s) => s.reaction.kind === 'formation'))!;
    // CO2 cancels exactly: the route rests on m1 alone, u = 1, not √(0.1² + 0.1² + 1²).
    expect(viaFormation.uncertainty).toBeCloseTo(1, 12);
    expect(viaFormation.missing).toEqual([]);
  });

  it('rejects a route that would mix aqueous and gaseous ion conventions', () => {
    const species = new Map([
      ['Na^+(g)', { charge: 1, phase: 'g' }],
      ['Na^+(aq)', { charge: 1, phase: 'aq' }],
    ]);
    const known = [formation('Na^+(g)', '609.4', 0.3), formation('Na^+(aq)', '-240.34', 0.06)];
    const network = buildHessNetwork(known, species);
    const result = findRoutes(network, target({ 'Na^+(g)': -1, 'Na^+(aq)': 1 }), inputsOf(known), options());
    expect(result.routes).toHaveLength(0);
    expect(result.rejectedMixedConventions).toBe(1);
  });

  it('stops at the examination bound and says so', () => {
    const known = Array.from({ length: 30 }, (_, i) =>
      reaction(`measured:${i}`, 'measured', { 'X(g)': -1, [`Y${i}(g)`]: 1 }, `${i}`, 1),
    );
    const network = buildHessNetwork(known, noSpeciesInfo);
    const result = findRoutes(network, target({ 'X(g)': 1 }), inputsOf(known), options({ maxExamined: 5 }));
    expect(result.stoppedBy).toBe('examined');
    expect(result.examined).toBe(5);
  });
});

/** Deterministic random source for generated networks. */
function prng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * A generated network with known true values: species with chosen ΔfH° (exact rationals), and
 * measured reactions whose ΔH is computed exactly from them. Some species are "unknown" (no
 * formation reaction), so their ΔfH° can only be derived.
 */
function generatedNetwork(seed: number, speciesCount = 40, reactionCount = 80) {
  const random = prng(seed);
  const truth = new Map<string, Fraction>();
  for (let i = 0; i < speciesCount; i++) truth.set(`S${i}(g)`, new Fraction(Math.round(random() * 2000 - 1000), 4));
  const names = [...truth.keys()];
  const unknown = new Set(names.filter((_, i) => i % 5 === 0));
  const known: KnownReaction[] = names
    .filter((s) => !unknown.has(s))
    .map((s) => formation(s, truth.get(s)!.toFraction(), 0.5));
  for (let r = 0; r < reactionCount; r++) {
    const size = 2 + Math.floor(random() * 3);
    const terms: Record<string, string> = {};
    while (Object.keys(terms).length < size) {
      const s = names[Math.floor(random() * names.length)]!;
      const c = new Fraction(1 + Math.floor(random() * 3), 1 + Math.floor(random() * 2)).mul(random() < 0.5 ? -1 : 1);
      terms[s] = c.toFraction();
    }
    const deltaH = Object.entries(terms).reduce((sum, [s, c]) => sum.add(truth.get(s)!.mul(F(c))), F(0));
    known.push(reaction(`measured:${r}`, 'measured', terms, deltaH.toFraction(), 1));
  }
  return { truth, unknown, known };
}

describe('findRoutes — generated networks with known true values', () => {
  it('derives every reachable unknown ΔfH° exactly (fractions, not floats)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000 }), (seed) => {
        const { truth, unknown, known } = generatedNetwork(seed);
        const network = buildHessNetwork(known, noSpeciesInfo);
        const inputs = inputsOf(known);
        for (const species of unknown) {
          const result = findRoutes(network, target({ [species]: 1 }), inputs, options({ maxSteps: 3 }));
          for (const route of result.routes) {
            expect(route.deltaH.equals(truth.get(species)!)).toBe(true);
            // Minimal: the sum of the steps is exactly the target, and every multiplier is non-zero.
            const sum = new Map<string, Fraction>();
            for (const step of route.steps)
              for (const term of step.reaction.terms)
                sum.set(term.species, (sum.get(term.species) ?? F(0)).add(term.coefficient.mul(step.multiplier)));
            for (const [s, c] of sum) expect(c.equals(s === species ? 1 : 0)).toBe(true);
            expect(route.steps.every((step) => !step.multiplier.equals(0))).toBe(true);
          }
        }
      }),
      { numRuns: 25 },
    );
  });

  it('returns only minimal routes: no proper subset of a route adds up to the target', () => {
    const { unknown, known } = generatedNetwork(42, 12, 20);
    const network = buildHessNetwork(known, noSpeciesInfo);
    const inputs = inputsOf(known);
    for (const species of unknown) {
      const result = findRoutes(network, target({ [species]: 1 }), inputs, options({ maxSteps: 4 }));
      for (const route of result.routes) {
        const ids = route.steps.map((s) => s.reaction);
        // Brute force over proper subsets: none may reproduce the target (checked by floating least
        // squares here, independently of the exact solver under test).
        for (let mask = 1; mask < (1 << ids.length) - 1; mask++) {
          const subset = ids.filter((_, i) => mask & (1 << i));
          expect(spans(subset, species)).toBe(false);
        }
      }
    }
  });
});

describe('findRoutes — stopping once enough routes are in hand', () => {
  // An invented network: X(g) has no ΔfH°; three measured reactions X → A_i close it in one step
  // (A_i have a ΔfH°), and a chain X → Y → B closes it in two (Y has no ΔfH°), with the smallest
  // uncertainty of all, so a complete search ranks it first.
  const oneStep = (i: number, u: number | null) =>
    reaction(`measured:x-a${i}`, 'measured', { 'X(g)': -1, [`A${i}(g)`]: 1 }, `${10 + i}`, u);
  const network = (u: number | null, direct = 3) => {
    const known = [
      ...Array.from({ length: direct }, (_, i) => formation(`A${i}(g)`, `${-20 - i}`, 0.5)),
      formation('B(g)', '-5', 0.01),
      ...Array.from({ length: direct }, (_, i) => oneStep(i, u)),
      reaction('measured:x-y', 'measured', { 'X(g)': -1, 'Y(g)': 1 }, '1', 0.01),
      reaction('measured:y-b', 'measured', { 'Y(g)': -1, 'B(g)': 1 }, '2', 0.01),
    ];
    return { known, network: buildHessNetwork(known, noSpeciesInfo) };
  };
  const measuredSteps = (route: { steps: { reaction: KnownReaction }[] }) =>
    route.steps.filter((s) => s.reaction.kind !== 'formation').length;

  it('stops after the step count that gave enough routes, says so, and returns the shortest routes', () => {
    const { known, network: net } = network(1);
    const result = findRoutes(net, target({ 'X(g)': 1 }), inputsOf(known), options({ enoughRoutes: 2 }));
    expect(result.stoppedBy).toBe('routes');
    expect(result.completeUpTo).toBe(1);
    expect(result.found).toBe(3);
    expect(result.routes.map(measuredSteps)).toEqual([1, 1, 1]);
    // Hand-summed: X = A_i − (X → A_i), so ΔfH°(X) = ΔfH°(A_i) − ΔH_i = −30, −32, −34 kJ/mol.
    expect(result.routes.map((r) => r.deltaH.toFraction()).sort()).toEqual(['-30', '-32', '-34']);
  });

  it('finds the longer route when not stopped early, ranked first by its uncertainty', () => {
    const { known, network: net } = network(1);
    const result = findRoutes(net, target({ 'X(g)': 1 }), inputsOf(known), options({ enoughRoutes: Infinity }));
    expect(result.stoppedBy).toBeNull();
    expect(result.completeUpTo).toBe(6);
    expect(result.found).toBe(4);
    // X = B − (Y → B) − (X → Y): −5 − 2 − 1 = −8 kJ/mol.
    expect(measuredSteps(result.routes[0]!)).toBe(2);
    expect(result.routes[0]!.deltaH.equals(F(-8))).toBe(true);
  });

  it('counts towards enough only routes whose every uncertainty is stated', () => {
    const { known, network: net } = network(null);
    const result = findRoutes(net, target({ 'X(g)': 1 }), inputsOf(known), options({ enoughRoutes: 2 }));
    expect(result.stoppedBy).toBeNull();
    expect(result.found).toBe(4);
  });

  it('defaults to four times the routes asked for', () => {
    // maxRoutes = 1: four stated routes of one step are enough, three are not.
    const three = network(1, 3);
    expect(
      findRoutes(three.network, target({ 'X(g)': 1 }), inputsOf(three.known), options({ maxRoutes: 1 })).stoppedBy,
    ).toBeNull();
    const four = network(1, 4);
    const result = findRoutes(four.network, target({ 'X(g)': 1 }), inputsOf(four.known), options({ maxRoutes: 1 }));
    expect(result.stoppedBy).toBe('routes');
    expect(result.found).toBe(4);
    expect(result.routes).toHaveLength(1);
  });

  it('does not claim to have stopped when nothing longer was left to examine', () => {
    const known = [formation('A0(g)', '-20', 0.5), formation('A1(g)', '-21', 0.5), oneStep(0, 1), oneStep(1, 1)];
    const net = buildHessNetwork(known, noSpeciesInfo);
    const result = findRoutes(net, target({ 'X(g)': 1 }), inputsOf(known), options({ enoughRoutes: 1 }));
    expect(result.stoppedBy).toBeNull();
    expect(result.found).toBe(2);
  });

  it('finds, when it stops at k reactions, exactly the routes of up to k reactions a complete search finds', () => {
    let stopped = 0;
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000 }), fc.integer({ min: 1, max: 6 }), (seed, enough) => {
        const { unknown, known } = generatedNetwork(seed);
        const net = buildHessNetwork(known, noSpeciesInfo);
        const inputs = inputsOf(known);
        const key = (route: { steps: { reaction: KnownReaction; multiplier: Fraction }[] }) =>
          route.steps
            .map((s) => `${s.reaction.id}*${s.multiplier.toFraction()}`)
            .sort()
            .join(' ');
        for (const species of unknown) {
          const all = options({ maxSteps: 3, maxRoutes: 10_000 });
          const full = findRoutes(net, target({ [species]: 1 }), inputs, { ...all, enoughRoutes: Infinity });
          const early = findRoutes(net, target({ [species]: 1 }), inputs, { ...all, enoughRoutes: enough });
          if (early.stoppedBy === null) {
            expect(early.found).toBe(full.found);
            continue;
          }
          expect(early.stoppedBy).toBe('routes');
          stopped++;
          expect(early.found).toBeGreaterThanOrEqual(enough);
          const shortest = full.routes
            .filter((r) => measuredSteps(r) <= early.completeUpTo)
            .map(key)
            .sort();
          expect(early.routes.map(key).sort()).toEqual(shortest);
        }
      }),
      { numRuns: 15 },
    );
    expect(stopped).toBeGreaterThan(0); // the early stop was exercised, not only complete searches
  });
});

/** Whether `species` alone (the target) lies in the span of the reactions' vectors (Gram–Schmidt). */
function spans(reactions: KnownReaction[], species: string): boolean {
  const keys = [...new Set(reactions.flatMap((r) => r.terms.map((t) => t.species)).concat(species))];
  const vec = (r: KnownReaction) => keys.map((k) => r.terms.find((t) => t.species === k)?.coefficient.valueOf() ?? 0);
  const basis: number[][] = [];
  for (const r of reactions) {
    let v = vec(r);
    for (const b of basis) {
      const d = v.reduce((s, x, i) => s + x * b[i]!, 0);
      v = v.map((x, i) => x - d * b[i]!);
    }
    const norm = Math.hypot(...v);
    if (norm > 1e-9) basis.push(v.map((x) => x / norm));
  }
  let t: number[] = keys.map((k) => (k === species ? 1 : 0));
  for (const b of basis) {
    const d = t.reduce((s, x, i) => s + x * b[i]!, 0);
    t = t.map((x, i) => x - d * b[i]!);
  }
  return Math.hypot(...t) < 1e-9;
}

describe('combineRoutes', () => {
  it('matches the best linear unbiased estimate of two correlated measurements', () => {
    // BLUE of two correlated estimates (Lyons, Gibaut & Clifford, Nucl. Instrum. Methods A270 (1988) 110;
    // from memory): w1 = (σ2² − ρσ1σ2)/(σ1² + σ2² − 2ρσ1σ2), σ² = σ1²σ2²(1 − ρ²)/(σ1² + σ2² − 2ρσ1σ2).
    const [s1, s2, rho] = [1.0, 2.0, 0.3];
    const cov = [
      [s1 ** 2, rho * s1 * s2],
      [rho * s1 * s2, s2 ** 2],
    ];
    const result = combineRoutes([10, 12], cov);
    const denominator = s1 ** 2 + s2 ** 2 - 2 * rho * s1 * s2;
    const w1 = (s2 ** 2 - rho * s1 * s2) / denominator;
    expect(result.value).toBeCloseTo(w1 * 10 + (1 - w1) * 12, 12);
    expect(result.uncertainty).toBeCloseTo(Math.sqrt((s1 ** 2 * s2 ** 2 * (1 - rho ** 2)) / denominator), 12);
    expect(result.degreesOfFreedom).toBe(1);
  });

  it('flags disagreement with the χ² test and the route that lies off', () => {
    // χ²(1) at p = 0.05 is 3.841 (statistical tables, e.g. NIST/SEMATECH e-Handbook; from memory).
    const agreeing = combineRoutes(
      [0, 1.9],
      [
        [0.5, 0],
        [0, 0.5],
      ],
    );
    expect(agreeing.chiSquare).toBeCloseTo(1.9 ** 2 / 1, 12);
    expect(agreeing.consistent).toBe(true);
    const disagreeing = combineRoutes(
      [0, 2.0],
      [
        [0.5, 0],
        [0, 0.5],
      ],
    );
    expect(disagreeing.chiSquare).toBeGreaterThan(3.841);
    expect(disagreeing.consistent).toBe(false);
  });
});

describe('consistencyFit', () => {
  it('reduces to the weighted mean for one species measured twice', () => {
    const result = consistencyFit(
      ['X'],
      [
        { id: 'a', label: 'a', terms: [{ species: 'X', coefficient: F(1) }], deltaH: 10, uncertainty: 1 },
        { id: 'b', label: 'b', terms: [{ species: 'X', coefficient: F(1) }], deltaH: 12, uncertainty: 2 },
      ],
      new Map(),
    );
    // Weighted mean (10/1 + 12/4)/(1 + 1/4) = 10.4, u = 1/√1.25 (Taylor, ch. 7; from memory).
    expect(result.fitted[0]!.value).toBeCloseTo(10.4, 12);
    expect(result.fitted[0]!.uncertainty).toBeCloseTo(1 / Math.sqrt(1.25), 12);
    expect(result.chiSquare).toBeCloseTo((10 - 10.4) ** 2 + (12 - 10.4) ** 2 / 4, 12);
    expect(result.birgeRatio).toBeCloseTo(Math.sqrt(result.chiSquare), 12);
  });

  it('recovers the true values of a generated network and flags one corrupted measurement', () => {
    const { truth, known } = generatedNetwork(7, 30, 120);
    const fitted = ['S0(g)', 'S1(g)', 'S2(g)', 'S3(g)', 'S4(g)', 'S5(g)'];
    const held = new Map(
      [...truth].filter(([s]) => !fitted.includes(s)).map(([s, v]) => [s, { value: v.valueOf(), uncertainty: 0.5 }]),
    );
    const measurements = known
      .filter((r) => r.kind === 'measured')
      .map((r) => ({ id: r.id, label: r.id, terms: r.terms, deltaH: r.deltaH.valueOf(), uncertainty: 1 }));
    const clean = consistencyFit(fitted, measurements, held);
    for (const f of clean.fitted) expect(f.value).toBeCloseTo(truth.get(f.species)!.valueOf(), 6);
    expect(clean.residuals.every((r) => !r.flagged)).toBe(true);
    // Corrupt one measurement that involves a fitted species by 25 kJ/mol.
    const victim = measurements.findIndex((m) => m.terms.some((t) => fitted.includes(t.species)));
    const corrupted = measurements.map((m, i) => (i === victim ? { ...m, deltaH: m.deltaH + 25 } : m));
    const result = consistencyFit(fitted, corrupted, held);
    const flagged = result.residuals.filter((r) => r.flagged).map((r) => r.id);
    expect(flagged).toContain(measurements[victim]!.id);
    expect(result.birgeRatio!).toBeGreaterThan(1);
  });
});
