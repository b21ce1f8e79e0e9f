import Fraction from 'fraction.js';
import { parseFormula } from '@shared/chemistry/index';
import {
  buildHessNetwork,
  type HessNetwork,
  type InputInfo,
  type InputWeight,
  type KnownReaction,
  type NetworkSpecies,
} from '@shared/chemistry/hess/index';
import { citationOf } from './present';
import { coversTemperature, enthalpyIncrement, prepareThermoModel } from '@shared/chemistry/thermo/index';
import { selectedModel, selectedValue, type LibrarySnapshot, type ReactionEntry, type SpeciesEntry } from './snapshot';

/**
 * The combiner's view of one library revision: the formation reaction of every species with a
 * selected ΔfH° and every measured reaction at 298.15 K, in the space without the elements'
 * reference states. Built once per snapshot and kept with it.
 */
export interface LibraryNetwork {
  network: HessNetwork;
  inputs: Map<string, InputInfo>;
  /** Keys of the elements' reference-state species (left out of every reaction). */
  referenceKeys: Set<string>;
  /** Measured reactions left out, with why: in words and as a cause to count by. */
  excluded: ExcludedReaction[];
}

export interface ExcludedReaction {
  key: string;
  reason: string;
  /** 'restates': not independent of the library's values; 'no-heat-capacity': not at 298.15 K and no Cp to bring it there. */
  cause: 'restates' | 'no-heat-capacity';
}

const networks = new WeakMap<LibrarySnapshot, LibraryNetwork>();

/** Reaction id of a species' formation reaction in the network (also its input id). */
export const formationId = (speciesId: string) => `formation:${speciesId}`;
export const measuredId = (reactionId: string) => `measured:${reactionId}`;

/** Exact rational of a decimal text ("−393.51" → −39351/100). */
export function exact(decimal: string | number): Fraction {
  return new Fraction(typeof decimal === 'number' ? String(decimal) : decimal);
}

/** The formation reaction as text: elements in their reference states → the species. */
export function formationEquation(snapshot: LibrarySnapshot, species: SpeciesEntry): string {
  const counts = new Map<string, number>();
  for (const match of species.hill.matchAll(/([A-Z][a-z]?)(\d*)/g)) {
    counts.set(match[1]!, (counts.get(match[1]!) ?? 0) + Number(match[2] || '1'));
  }
  const left: string[] = [];
  for (const [element, n] of counts) {
    const reference = snapshot.referenceStates.get(element);
    if (!reference) {
      left.push(`${n} ${element}`);
      continue;
    }
    const atoms = Number(/(\d+)$/.exec(reference.hill)?.[1] ?? '1');
    const multiplier = new Fraction(n, atoms);
    left.push(`${multiplier.equals(1) ? '' : `${multiplier.toFraction()} `}${reference.key}`);
  }
  // Charge by the conventions: aqueous ions against H⁺(aq) and H2(g), gaseous ions against e⁻(g).
  const z = species.charge;
  const right = [species.key];
  if (z !== 0 && species.phase === 'aq') {
    const half = new Fraction(Math.abs(z), 2).toFraction();
    if (z > 0) {
      left.push(`${Math.abs(z) === 1 ? '' : `${Math.abs(z)} `}H^+(aq)`);
      right.push(`${half} H2(g)`);
    } else {
      left.push(`${half} H2(g)`);
      right.push(`${Math.abs(z) === 1 ? '' : `${Math.abs(z)} `}H^+(aq)`);
    }
  } else if (z !== 0) {
    const electrons = `${Math.abs(z) === 1 ? '' : `${Math.abs(z)} `}e^-(g)`;
    if (z > 0) right.push(electrons);
    else left.push(electrons);
  }
  return `${left.join(' + ') || '(elements)'} -> ${right.join(' + ')}`;
}

/** The network of a snapshot, built on first use. */
export function libraryNetworkOf(snapshot: LibrarySnapshot): LibraryNetwork {
  const cached = networks.get(snapshot);
  if (cached) return cached;
  const referenceKeys = new Set([...snapshot.referenceStates.values()].map((s) => s.key));
  const reactions: KnownReaction[] = [];
  const inputs = new Map<string, InputInfo>();
  const species = new Map<string, NetworkSpecies>();
  for (const entry of snapshot.species.values()) {
    species.set(entry.key, { charge: entry.charge, phase: entry.phase });
    if (referenceKeys.has(entry.key)) continue;
    const value = selectedValue(snapshot, entry.id, 'dfH298');
    if (!value) continue;
    const id = formationId(entry.id);
    const source = snapshot.sources.get(value.sourceId);
    const basis = derivedBasis(value.derivation);
    // Inputs a derived value rests on that the library does not hold (a team's own measurement):
    // registered with the uncertainty its derivation recorded, so routes count them once.
    for (const extra of derivedInputs(value.derivation))
      if (!extra.id.startsWith('formation:') && !extra.id.startsWith('measured:')) inputs.set(extra.id, extra);
    reactions.push({
      id,
      kind: 'formation',
      refId: entry.id,
      equation: formationEquation(snapshot, entry),
      terms: [{ species: entry.key, coefficient: new Fraction(1) }],
      deltaH: exact(value.valueText),
      uncertainty: value.standardUncertainty,
      ...(basis ? { basis } : {}),
      ...(source ? { source: citationOf(source) } : {}),
    });
    inputs.set(id, { id, label: `ΔfH°(${entry.key})`, uncertainty: value.standardUncertainty });
  }
  const excluded: LibraryNetwork['excluded'] = [];
  for (const r of snapshot.reactions) {
    if (!r.independent) {
      excluded.push({ key: r.key, reason: 'restates values the library already holds', cause: 'restates' });
      continue;
    }
    let deltaH = exact(r.deltaHText);
    if (Math.abs(r.temperature - 298.15) > 0.005) {
      const corrected = atReferenceTemperature(snapshot, r);
      if (corrected === null) {
        excluded.push({
          key: r.key,
          reason: `measured at ${r.temperature} K, and not every species has a heat-capacity model there`,
          cause: 'no-heat-capacity',
        });
        continue;
      }
      deltaH = corrected;
    }
    const id = measuredId(r.id);
    const source = snapshot.sources.get(r.sourceId);
    reactions.push({
      id,
      kind: 'measured',
      refId: r.id,
      equation: r.equation,
      terms: r.terms
        .filter((t) => !referenceKeys.has(t.key))
        .map((t) => ({ species: t.key, coefficient: new Fraction(t.coefficient) })),
      deltaH,
      uncertainty: r.standardUncertainty,
      ...(source ? { source: citationOf(source) } : {}),
    });
    inputs.set(id, { id, label: r.equation, uncertainty: r.standardUncertainty });
    for (const t of r.terms) {
      if (species.has(t.key)) continue;
      // A finite-concentration solute, which exists only in reactions: charge from its key.
      species.set(t.key, { charge: parseFormula(t.key).charge, phase: 'aq' });
    }
  }
  const built: LibraryNetwork = { network: buildHessNetwork(reactions, species), inputs, referenceKeys, excluded };
  networks.set(snapshot, built);
  return built;
}

/**
 * ΔrH at 298.15 K of a reaction measured at T, by Kirchhoff with the selected models:
 * ΔH(298.15) = ΔH(T) − Σν [H(T) − H(298.15 K)]. Null when a species has no model covering T.
 * The result keeps 12 significant digits as an exact decimal (the models are not exact).
 */
function atReferenceTemperature(snapshot: LibrarySnapshot, r: ReactionEntry): Fraction | null {
  let increment = 0;
  for (const t of r.terms) {
    const entry = t.speciesId ? snapshot.species.get(t.speciesId) : undefined;
    const model = entry ? selectedModel(snapshot, entry.id) : null;
    if (!entry || !model) return null;
    const prepared = prepareThermoModel({ species: entry.key, scale: model.scale, forms: model.forms });
    if (!coversTemperature(prepared, r.temperature) || !coversTemperature(prepared, 298.15)) return null;
    increment += new Fraction(t.coefficient).valueOf() * enthalpyIncrement(prepared, r.temperature);
  }
  return exact(r.deltaHText).sub(exact(increment.toPrecision(12)));
}

/** The inputs a derived value's derivation records with labels and uncertainties. */
export function derivedInputs(derivation: Record<string, unknown> | null): InputInfo[] {
  const weights = derivation?.['weights'];
  if (!Array.isArray(weights)) return [];
  const out: InputInfo[] = [];
  for (const w of weights) {
    if (typeof w !== 'object' || w === null) continue;
    const { input, label, uncertainty } = w as { input?: unknown; label?: unknown; uncertainty?: unknown };
    if (typeof input !== 'string') continue;
    out.push({
      id: input,
      label: typeof label === 'string' ? label : input,
      uncertainty: typeof uncertainty === 'number' ? uncertainty : null,
    });
  }
  return out;
}

/** The inputs a derived library value rests on, when its derivation records them. */
export function derivedBasis(derivation: Record<string, unknown> | null): InputWeight[] | null {
  const weights = derivation?.['weights'];
  if (!Array.isArray(weights)) return null;
  const basis: InputWeight[] = [];
  for (const w of weights) {
    if (typeof w !== 'object' || w === null) return null;
    const { input, weight } = w as { input?: unknown; weight?: unknown };
    if (typeof input !== 'string' || typeof weight !== 'string') return null;
    basis.push({ input, weight: new Fraction(weight) });
  }
  return basis.length > 0 ? basis : null;
}
