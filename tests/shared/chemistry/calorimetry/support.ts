/**
 * Test support for the calorimetry core: a seeded random source and synthetic calorimeter curves
 * with known answers. Nothing here calls the code under test.
 */

/** mulberry32: a small seeded generator of uniform numbers in (0, 1) (public-domain algorithm). */
export function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform over a seeded uniform source. */
export function seededNormal(seed: number): () => number {
  const uniform = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
}

export interface NewtonianRun {
  /** Exchange constant k, 1/s. */
  k: number;
  /** Convergence temperature T∞ (jacket plus stirring), K. */
  convergence: number;
  /** Temperature at t = 0, K. */
  start: number;
  /** Adiabatic rise of the whole heat release, K. */
  rise: number;
  /** Rate constant of the first-order heat release, 1/s. */
  release: number;
  /** Time the release starts (the mixing time), s. */
  mixingTime: number;
  /** Reading interval and last reading, s. */
  step: number;
  end: number;
  /** Standard deviation of the reading noise, K (0: none). */
  noise?: number;
  seed?: number;
}

/**
 * Readings of a calorimeter obeying Newton's law with stirring, dT/dt = k(T∞ − T) + p(t), with a
 * first-order heat release p(t) = ΔT_ad·λ·e^{−λ(t − t_i)} after t_i (the model of the domain
 * notes §5; common practice, no source), solved exactly:
 *   T(t) = T∞ + (T₀ − T∞)e^{−kt} + ΔT_ad·λ/(k − λ)·(e^{−λ(t − t_i)} − e^{−k(t − t_i)}) for t > t_i.
 */
export function newtonianReadings(run: NewtonianRun): [number, number][] {
  const normal = seededNormal(run.seed ?? 1);
  const out: [number, number][] = [];
  for (let i = 0; i * run.step <= run.end + 1e-9; i++) {
    const t = i * run.step;
    let T = run.convergence + (run.start - run.convergence) * Math.exp(-run.k * t);
    if (t > run.mixingTime) {
      const tau = t - run.mixingTime;
      T += ((run.rise * run.release) / (run.k - run.release)) * (Math.exp(-run.release * tau) - Math.exp(-run.k * tau));
    }
    if (run.noise) T += run.noise * normal();
    out.push([t, T]);
  }
  return out;
}

/** The rise without heat exchange between t_i and t_f: ∫ p dt = ΔT_ad(1 − e^{−λ(t_f − t_i)}). */
export function trueRise(run: NewtonianRun, afterPeriodStart: number): number {
  return run.rise * (1 - Math.exp(-run.release * (afterPeriodStart - run.mixingTime)));
}
