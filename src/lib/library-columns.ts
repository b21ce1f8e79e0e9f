/**
 * The columns the library table can show, in order, with the sort key the API knows for each
 * sortable one. Pure data.
 */
import type { SpeciesSort } from './library-query';

export type LibraryColumnId =
  | 'key'
  | 'name'
  | 'formula'
  | 'hill'
  | 'phase'
  | 'deltaFH'
  | 'provenance'
  | 'sources'
  | 'molarMass'
  | 'cas'
  | 'modelRange';

export interface LibraryColumn {
  id: LibraryColumnId;
  label: string;
  /** Longer words for the column chooser and the header's title. */
  description: string;
  sort: Exclude<SpeciesSort, 'relevance'> | null;
  numeric: boolean;
}

export const libraryColumns: readonly LibraryColumn[] = [
  { id: 'key', label: 'Key', description: 'Library key (formula and phase)', sort: null, numeric: false },
  { id: 'name', label: 'Name', description: 'Name', sort: 'name', numeric: false },
  { id: 'formula', label: 'Formula', description: 'Formula as written', sort: 'formula', numeric: false },
  { id: 'hill', label: 'Hill', description: 'Hill formula', sort: null, numeric: false },
  { id: 'phase', label: 'Phase', description: 'Phase', sort: 'phase', numeric: false },
  {
    id: 'deltaFH',
    label: 'ΔfH° / kJ mol⁻¹',
    description: 'Selected ΔfH°(298.15 K) ± standard uncertainty, kJ/mol',
    sort: 'deltaFH',
    numeric: true,
  },
  { id: 'provenance', label: 'Provenance', description: 'Provenance of the selected ΔfH°', sort: null, numeric: false },
  { id: 'sources', label: 'Sources', description: 'Sources with a value or model', sort: null, numeric: false },
  { id: 'molarMass', label: 'M / g mol⁻¹', description: 'Molar mass, g/mol', sort: 'molarMass', numeric: true },
  { id: 'cas', label: 'CAS RN', description: 'CAS Registry Number', sort: null, numeric: false },
  {
    id: 'modelRange',
    label: 'Cp model / K',
    description: 'Valid range of the selected heat-capacity model, K',
    sort: null,
    numeric: false,
  },
];

export const defaultColumns: readonly LibraryColumnId[] = ['key', 'name', 'phase', 'deltaFH', 'provenance', 'sources'];
