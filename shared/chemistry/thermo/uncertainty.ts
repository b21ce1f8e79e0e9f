import { ThermoInputError } from './errors';

/**
 * An uncertainty as a source states it (seeds/library/FORMAT.md, `uncertainty_kind`), in the
 * unit of the value it belongs to (kJ/mol for ΔfH°).
 * - `standard`: a standard uncertainty u (k = 1);
 * - `expanded`: an expanded uncertainty U with its coverage factor k;
 * - `two-sigma`: twice the standard deviation (of the mean), the thermochemists' usual ±;
 * - `interval`: ± limits whose coverage the source leaves unspecified (e.g. CODATA Key Values);
 * - `none`: no uncertainty stated.
 */
export type StatedUncertainty =
  | { kind: 'standard'; value: number }
  | { kind: 'expanded'; value: number; k: number }
  | { kind: 'two-sigma'; value: number }
  | { kind: 'interval'; value: number }
  | { kind: 'none' };

/** The standard uncertainty derived from a stated one, with the rule used, for recording beside the value. */
export interface DerivedStandardUncertainty {
  /** Standard uncertainty u in the unit of the stated value; null when none was stated. */
  u: number | null;
  kind: StatedUncertainty['kind'];
  /** The rule in words, e.g. "expanded uncertainty U with k = 2: u = U/k (GUM, JCGM 100:2008, 6.2)". */
  rule: string;
}

/**
 * Converts a stated uncertainty to a standard uncertainty u (GUM, JCGM 100:2008; NIST TN 1297):
 * standard → u; expanded → U/k; two-sigma → value/2; interval → U/2 (reading limits of
 * unspecified coverage as about two standard uncertainties is common practice, no source;
 * the rule text says so); none → null.
 * @throws ThermoInputError for a negative or non-finite value or a coverage factor k ≤ 0.
 */
export function standardUncertainty(stated: StatedUncertainty): DerivedStandardUncertainty {
  if (stated.kind === 'none') return { u: null, kind: 'none', rule: 'no uncertainty stated by the source' };
  if (typeof stated.value !== 'number' || !Number.isFinite(stated.value) || stated.value < 0)
    throw new ThermoInputError(`uncertainty must be a finite value ≥ 0 (got ${String(stated.value)})`, ['uncertainty']);
  switch (stated.kind) {
    case 'standard':
      return { u: stated.value, kind: stated.kind, rule: 'stated as a standard uncertainty (k = 1): u = stated value' };
    case 'expanded':
      if (typeof stated.k !== 'number' || !Number.isFinite(stated.k) || stated.k <= 0)
        throw new ThermoInputError(`coverage factor k must be a finite value above 0 (got ${String(stated.k)})`, ['k']);
      return {
        u: stated.value / stated.k,
        kind: stated.kind,
        rule: `expanded uncertainty U with coverage factor k = ${stated.k}: u = U/k (GUM, JCGM 100:2008, 6.2)`,
      };
    case 'two-sigma':
      return {
        u: stated.value / 2,
        kind: stated.kind,
        rule: 'stated as twice the standard deviation (of the mean): u = stated value / 2',
      };
    case 'interval':
      return {
        u: stated.value / 2,
        kind: stated.kind,
        rule: '± limits of unspecified coverage read as about two standard uncertainties: u = U/2 (common practice, no source)',
      };
  }
}
