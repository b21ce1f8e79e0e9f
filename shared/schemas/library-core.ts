import { z } from 'zod';

/**
 * Words of the library shared by the seed files, the database, the API and the pages.
 * Conventions: standard pressure 1 bar, reference temperature 298.15 K, elements in their reference
 * states have ΔfH° = 0, aqueous ions on the convention ΔfH°(H⁺, aq) = 0.
 */

/** Phases a library species can have. `cr` covers every crystalline solid; `aq` is the 1 mol/kg ideal solution. */
export const libraryPhases = ['g', 'l', 'cr', 'am', 'aq'] as const;
export const libraryPhaseSchema = z.enum(libraryPhases);
export type LibraryPhase = z.infer<typeof libraryPhaseSchema>;

/** Properties stored as single values: ΔfH°(298.15 K) in kJ/mol and S°(298.15 K) in J/(mol K). */
export const libraryProperties = ['dfH298', 'S298'] as const;
export const libraryPropertySchema = z.enum(libraryProperties);
export type LibraryProperty = z.infer<typeof libraryPropertySchema>;

/** Units each property is stored and served in. */
export const propertyUnits: Record<LibraryProperty, string> = { dfH298: 'kJ/mol', S298: 'J/(mol K)' };

/**
 * How a source states its uncertainty: a standard uncertainty u; an expanded uncertainty U with a
 * coverage factor k; twice the standard deviation (of the mean); ± limits of unspecified coverage
 * (the CODATA Key Values); or none.
 */
export const uncertaintyKinds = ['standard', 'expanded', 'two-sigma', 'interval', 'none'] as const;
export const uncertaintyKindSchema = z.enum(uncertaintyKinds);
export type UncertaintyKind = z.infer<typeof uncertaintyKindSchema>;

/** Where a value stands: our own state names. */
export const provenances = ['entered', 'checked', 'memory', 'derived', 'superseded'] as const;
export const provenanceSchema = z.enum(provenances);
export type Provenance = z.infer<typeof provenanceSchema>;

/** Plain words for each provenance state, shown wherever a value is. */
export const provenanceLabels: Record<Provenance, string> = {
  entered: 'Entered from the source, not yet checked',
  checked: 'Checked against the source',
  memory: 'Typed from memory, not yet checked against the source',
  derived: 'Derived in Thermoledger',
  superseded: 'Superseded',
};

export const sourceKinds = ['report', 'book', 'journal-article', 'dataset', 'compilation'] as const;
export const sourceKindSchema = z.enum(sourceKinds);
export type SourceKind = z.infer<typeof sourceKindSchema>;

/** What made a library revision. */
export const revisionKinds = ['seed', 'import', 'amendment'] as const;
export const revisionKindSchema = z.enum(revisionKinds);
export type RevisionKind = z.infer<typeof revisionKindSchema>;

/** How a measured reaction's ΔrH was obtained (reactions-*.csv `method`, amendment entries). */
export const reactionMethods = [
  'combustion-calorimetry',
  'solution-calorimetry',
  'reaction-calorimetry',
  'equilibrium',
  'phase-change',
  'computed',
  'other',
] as const;
export const reactionMethodSchema = z.enum(reactionMethods);
export type ReactionMethod = z.infer<typeof reactionMethodSchema>;

/** `formation`: H from the model is on the ΔfH scale (NASA polynomials); `relative`: only H(T) − H(298.15 K). */
export const modelScales = ['formation', 'relative'] as const;
export const modelScaleSchema = z.enum(modelScales);
export type ModelScale = z.infer<typeof modelScaleSchema>;

/** One form in a species' heat-capacity sequence (a polymorph, or the only form of a gas or liquid). */
export { thermoFormSchema as heatCapacityFormSchema } from './thermo';
export type { ThermoForm as HeatCapacityForm } from '../chemistry/thermo/index';
