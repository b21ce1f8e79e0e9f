/**
 * A source's uncertainty in words, as the source states it: the kind (standard, expanded with
 * its k, twice the standard deviation, ± limits of unspecified coverage, none), the ± figure and k.
 * Pure.
 */
import type { UncertaintyKind } from '@shared/schemas/library-core';
import { formatFull } from './uncertainty-rounding';

export const uncertaintyKindWords: Record<UncertaintyKind, string> = {
  standard: 'standard uncertainty u',
  expanded: 'expanded uncertainty U',
  'two-sigma': 'twice the standard deviation (2σ)',
  interval: '± limits, coverage not stated',
  none: 'none stated',
};

export interface StatedUncertainty {
  kind: UncertaintyKind;
  value: number | null;
  k: number | null;
}

/** "± 0.3 (twice the standard deviation (2σ))", "± 0.26, k = 2 (expanded uncertainty U)", "none stated". */
export function statedUncertaintyText(stated: StatedUncertainty): string {
  if (stated.kind === 'none' || stated.value === null) return 'none stated';
  const k = stated.k !== null ? `, k = ${formatFull(stated.k)}` : '';
  return `± ${formatFull(stated.value)}${k} (${uncertaintyKindWords[stated.kind]})`;
}
