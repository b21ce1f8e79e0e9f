import type { ReactionEnthalpyResult } from '@shared/schemas/reaction-enthalpy';

const pedley = {
  id: '6ad8da23-70e7-4f5f-aa23-3098599b193d',
  key: 'pedley-1986',
  citation: 'Pedley, Naylor & Kirby, Chapman and Hall, London (1986)',
};
const codata = {
  id: 'bbcdcf1b-7616-4d64-8eda-b033018d51a8',
  key: 'codata-1989',
  citation: 'Cox, Wagman & Medvedev, Hemisphere Publishing Corp., New York (1989)',
};
export const ids = {
  acid: '1c05e43c-343c-447a-ac28-aaf79476350f',
  ethanol: '35bd7e5a-6951-4970-ad1a-e49ee28b82a4',
  ester: '1c375dfe-18a2-4f2c-a66a-40cefd49abb4',
  water: 'df1fb7a8-5ec3-4dc6-9757-0291f0174287',
};

/**
 * The esterification as the API answers it at 298.15 K, with the values of the seed library
 * (Pedley 1986 and CODATA 1989, typed from memory there). The variance shares are ν²u²/Σν²u²:
 * 0.04, 0.0225, 0.16, 0.0004 over 0.2229 (hand calculation).
 */
export function esterification(overrides: Partial<ReactionEnthalpyResult> = {}): ReactionEnthalpyResult {
  const energy = (value: number, uncertainty: number | null) => ({ value, uncertainty, unit: 'kJ/mol' as const });
  const term = (
    formula: string,
    key: string,
    name: string,
    speciesId: string,
    side: 'reactant' | 'product',
    value: number,
    u: number | null,
    source: typeof pedley,
  ) => ({
    formula,
    phase: 'l' as const,
    descriptor: null,
    coefficient: '1',
    side,
    speciesId,
    key,
    name,
    deltaFH: { value, uncertainty: u },
    source,
    provenance: 'memory' as const,
    // Molar masses from the CIAAW 2021 standard atomic weights (hand sums); no model range here.
    molarMass: { CH3COOH: 60.052, C2H5OH: 46.069, CH3COOC2H5: 88.106, H2O: 18.015 }[formula] ?? 0,
    modelRange: null,
  });
  const total = 0.04 + 0.0225 + 0.16 + 0.0004;
  return {
    equation: 'CH3COOH(l) + C2H5OH(l) -> CH3COOC2H5(l) + H2O(l)',
    deltaH: energy(-3.63, Math.sqrt(total)),
    deltaU: energy(-3.63, Math.sqrt(total)),
    temperature: { value: 298.15, unit: 'K' },
    deltaH298: energy(-3.63, Math.sqrt(total)),
    terms: [
      term('CH3COOH', 'CH3COOH(l)', 'acetic acid', ids.acid, 'reactant', -484.5, 0.2, pedley),
      term('C2H5OH', 'C2H6O(l)', 'ethanol', ids.ethanol, 'reactant', -277.0, 0.15, pedley),
      term('CH3COOC2H5', 'C4H8O2(l)', 'ethyl acetate', ids.ester, 'product', -479.3, 0.4, pedley),
      term('H2O', 'H2O(l)', 'water', ids.water, 'product', -285.83, 0.02, codata),
    ],
    contributions: [
      {
        speciesId: ids.acid,
        key: 'CH3COOH(l)',
        coefficient: '-1',
        contribution: 484.5,
        uncertainty: 0.2,
        varianceShare: 0.04 / total,
      },
      {
        speciesId: ids.ethanol,
        key: 'C2H6O(l)',
        coefficient: '-1',
        contribution: 277.0,
        uncertainty: 0.15,
        varianceShare: 0.0225 / total,
      },
      {
        speciesId: ids.ester,
        key: 'C4H8O2(l)',
        coefficient: '1',
        contribution: -479.3,
        uncertainty: 0.4,
        varianceShare: 0.16 / total,
      },
      {
        speciesId: ids.water,
        key: 'H2O(l)',
        coefficient: '1',
        contribution: -285.83,
        uncertainty: 0.02,
        varianceShare: 0.0004 / total,
      },
    ],
    uncertaintyComplete: true,
    uncertaintyMissing: [],
    uncertaintyMethod: 'root-sum-square of ν·u over species taken as independent',
    deltaS: null,
    deltaG: null,
    K: null,
    deltaNGas: '0',
    transitions: [],
    constantCpEstimate: false,
    libraryRevision: 1,
    sources: [pedley, codata],
    heatingValues: null,
    curve: null,
    warnings: [],
    ...overrides,
  };
}
