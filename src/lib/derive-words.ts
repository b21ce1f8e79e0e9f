/**
 * The derive result in words: how the headline was obtained, whether the routes agree, what kind
 * of value each step rests on, and the few bits of typesetting the step table needs. Pure.
 */
import { parseEquation } from '@shared/chemistry/index';
import type { DeriveResult, DeriveRoute } from '@shared/schemas/derive';
import { listInWords } from './incomplete-uncertainty';
import { formatSignificant, MINUS } from './uncertainty-rounding';

type StepKind = DeriveRoute['steps'][number]['ref']['kind'];

/** Short words for the kind of value a step rests on. */
export const stepKindWords: Record<StepKind, string> = {
  formation: 'formation',
  measured: 'measured',
  given: 'given',
  derived: 'derived',
};

/** The longer words, for a title or a screen reader. */
export const stepKindDescriptions: Record<StepKind, string> = {
  formation: "the formation reaction of a library species, with the library's ΔfH°",
  measured: 'a measured reaction of the library',
  given: 'a reaction given with this derivation',
  derived: "a team's derived ΔfH°, itself obtained by Hess's law",
};

/** "route" or "routes". */
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** How the headline value was obtained, in one sentence. */
export function basisSentence(result: DeriveResult): string {
  const n = result.routes.length;
  switch (result.basis) {
    case 'combined': {
      const used = result.routes.filter((r) => r.uncertaintyComplete).length;
      return `Combined by generalised least squares from the ${plural(used, 'route', 'routes')} that state a full uncertainty and agree; inputs that routes share are counted once, through their covariance.`;
    }
    case 'best-route':
      if (result.agreement && !result.consistent)
        return `The best-ranked route's value (route 1): the ${n} routes do not agree within their uncertainties, so they are not combined.`;
      return `The best-ranked route's value (route 1): fewer than two routes state a full uncertainty, so the ${n} routes could not be compared or combined.`;
    case 'single-route':
      return 'The only route found.';
    default:
      return '';
  }
}

export interface RouteBadge {
  kind: 'agrees' | 'flagged' | 'not-compared' | 'only';
  text: string;
  /** A sentence for the title and screen readers. */
  description: string;
}

/** A route's badge: agrees, flagged, or not compared (no full uncertainty, or nothing to compare with). */
export function routeBadge(result: DeriveResult, route: DeriveRoute): RouteBadge {
  if (result.routes.length === 1)
    return { kind: 'only', text: 'only route', description: 'The only route: nothing to compare it with.' };
  if (!result.agreement || route.normalizedResidual === null)
    return {
      kind: 'not-compared',
      text: 'not compared',
      description: route.uncertaintyComplete
        ? 'Not compared: no other route states a full uncertainty.'
        : `Not compared: no uncertainty is stated for ${listInWords(route.missing)}.`,
    };
  const sigmas = Math.abs(route.normalizedResidual);
  const distance = Number.isFinite(sigmas)
    ? `${formatSignificant(sigmas, 2, 1)} standard deviations`
    : 'infinitely many standard deviations (it shares all its inputs with the others)';
  if (route.agrees)
    return {
      kind: 'agrees',
      text: 'agrees',
      description: `Agrees: ${distance} from the combined value (within 2).`,
    };
  return {
    kind: 'flagged',
    text: 'flagged',
    description: `Flagged: ${distance} from the combined value (more than 2).`,
  };
}

export interface Verdict {
  /** agree, disagree, or nothing to test. */
  tone: 'agree' | 'disagree' | 'none';
  headline: string;
  /** χ², degrees of freedom and p in words, when tested. */
  statistics: string | null;
  /** One sentence per flagged route. */
  flagged: string[];
}

/** p in words: "0.89", "0.0031", "< 0.0001". */
export function pText(p: number): string {
  if (p < 1e-4) return '< 0.0001';
  return formatSignificant(p, 2);
}

/** The agreement test of the routes, in words. */
export function agreementVerdict(result: DeriveResult): Verdict {
  const n = result.routes.length;
  if (result.status !== 'derived' || n === 0)
    return {
      tone: 'none',
      headline: 'No route was found, so there is nothing to compare.',
      statistics: null,
      flagged: [],
    };
  if (n === 1)
    return {
      tone: 'none',
      headline: 'One route only: there is nothing to compare it with.',
      statistics: null,
      flagged: [],
    };
  const a = result.agreement;
  if (!a) {
    const lacking = result.routes.filter((r) => !r.uncertaintyComplete).length;
    return {
      tone: 'none',
      headline: `Not tested: ${lacking} of the ${n} routes lack a full uncertainty, and a comparison needs at least two that state one.`,
      statistics: null,
      flagged: [],
    };
  }
  const compared = result.routes.filter((r) => r.normalizedResidual !== null).length;
  const dof = plural(a.degreesOfFreedom, 'degree of freedom', 'degrees of freedom');
  const chi = `χ² = ${formatSignificant(a.chiSquare, 3, 2)} on ${dof}`;
  const statistics =
    a.pValue === null
      ? `${chi}: the routes rest on the same inputs, so nothing independent is left to compare.`
      : `${chi}, p = ${pText(a.pValue)} (the routes are taken to disagree when p < 0.05).`;
  const flagged = result.routes.flatMap((route, i) => {
    if (route.agrees || route.normalizedResidual === null) return [];
    const sigmas = Math.abs(route.normalizedResidual);
    const distance = Number.isFinite(sigmas) ? `${formatSignificant(sigmas, 2, 1)}σ` : 'infinitely far';
    return [`Route ${i + 1} is flagged: it lies ${distance} from the combined value (more than 2σ).`];
  });
  const skipped = n - compared;
  const skippedWords =
    skipped > 0 ? ` (${plural(skipped, 'route', 'routes')} without a full uncertainty left out)` : '';
  return result.consistent
    ? {
        tone: 'agree',
        headline: `The ${plural(compared, 'route', 'routes')} compared agree within their uncertainties${skippedWords}.`,
        statistics,
        flagged,
      }
    : {
        tone: 'disagree',
        headline: `The ${plural(compared, 'route', 'routes')} compared do not agree within their uncertainties${skippedWords}.`,
        statistics,
        flagged,
      };
}

/**
 * Given reactions are numbered from 1 on the page; the server's messages and input labels count
 * from 0 ("reactions.0", "reaction 0 (…)"). Only the numbering is rewritten, for display.
 */
export function givenReactionWords(message: string): string {
  return message
    .replace(/\breactions\.(\d+)(\.\w+)*/g, (_, n: string) => `given reaction ${Number(n) + 1}`)
    .replace(/(?<!given )\breaction (\d+) \(/g, (_, n: string) => `given reaction ${Number(n) + 1} (`);
}

/** Warnings not said elsewhere on the page (the incomplete-uncertainty box, the verdict, the search note). */
export function otherWarnings(result: DeriveResult): string[] {
  const shownElsewhere = new Set(['uncertainty_incomplete', 'routes_disagree', 'search_stopped']);
  return result.warnings.filter((w) => !shownElsewhere.has(w.code)).map((w) => givenReactionWords(w.message));
}

/** The search note: why it stopped, and what that means. */
export function searchStoppedSentence(result: DeriveResult): string | null {
  const s = result.search;
  if (!s.stoppedBy) return null;
  const why =
    s.stoppedBy === 'time' ? 'its time budget ran out' : 'it reached the limit of combinations it may examine';
  return `The search stopped because ${why}, after examining ${s.examined.toLocaleString('en-GB')} combinations and finding ${plural(s.found, 'route', 'routes')}. Other routes may exist: the ones shown are the best found so far.`;
}

/** A step's multiplier as a sign, numerator and denominator ("-3/2" → −, 3, 2). */
export function multiplierParts(text: string): {
  sign: '' | typeof MINUS;
  numerator: string;
  denominator: string | null;
} {
  const negative = text.startsWith('-');
  const [numerator, denominator] = (negative ? text.slice(1) : text).split('/');
  return { sign: negative ? MINUS : '', numerator: numerator ?? text, denominator: denominator ?? null };
}

/** The same as plain text with a true minus ("−3/2"). */
export function multiplierText(text: string): string {
  const p = multiplierParts(text);
  return `${p.sign}${p.numerator}${p.denominator === null ? '' : `/${p.denominator}`}`;
}

/**
 * The species a target forms, when it is the formation of one species: every reactant a single
 * element (uncharged), one product with coefficient 1. Whether the elements are in their
 * reference states is the server's to say; this only decides whether saving is offered.
 */
export function formedSpecies(target: string): string | null {
  let parsed: ReturnType<typeof parseEquation>;
  try {
    parsed = parseEquation(target);
  } catch {
    return null;
  }
  const products = parsed.terms.filter((t) => t.side === 'product');
  const reactants = parsed.terms.filter((t) => t.side === 'reactant');
  if (products.length !== 1 || reactants.length === 0) return null;
  const product = products[0]!;
  if (product.coefficient.n !== product.coefficient.d) return null;
  const elementsOnly = reactants.every(
    (t) => t.species.charge === 0 && !t.species.electron && Object.keys(t.species.composition).length === 1,
  );
  if (!elementsOnly) return null;
  const s = product.species;
  return `${s.formula}${s.phase ? `(${s.phase}${s.descriptor ? `, ${s.descriptor}` : ''})` : ''}`;
}
