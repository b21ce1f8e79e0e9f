/**
 * Which NASA TM-4513 entry stands behind a library species key at 298.15 K.
 *
 * The NASA import (seeds/library/models-nasa.jsonl) is the authority: once it exists, each model's
 * species key and the source label of its forms are read from it. Until then, and for reconciling
 * the two, PROVISIONAL_NASA_LABELS states the keys the reference-value files use for species the
 * NASA file holds. They follow the NASA import's own mapping table (scripts/library/nasa-labels.ts on
 * the import's branch): proper-case formula as the report writes it (Hill formula for gaseous
 * isomers, with a descriptor), `cr` for every solid, polymorph sequences as one crystalline species,
 * descriptors for reference allotropes and labelled minerals (`S(cr, rhombic)`, `SiO2(cr, quartz)`).
 * One key differs on purpose: `C8H10(g, ethylbenzene)`, because this library adds the xylenes as
 * C8H10 gases, so the import's `C8H10(g)` needs the descriptor.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readNasaSource } from './import-nasa';
import { coversReferenceTemperature } from './nasa-polynomials';
import type { NasaSourceEntry } from './nasa-seed';

/** Library key → label of the NASA entry that covers 298.15 K (gases: the only entry). */
export const PROVISIONAL_NASA_LABELS: Readonly<Record<string, string>> = {
  // gases: elements, atoms, combustion and inorganic gases
  'O(g)': 'O',
  'O2(g)': 'O2',
  'H(g)': 'H',
  'H2(g)': 'H2',
  'H2O(g)': 'H2O',
  'He(g)': 'He',
  'Ne(g)': 'Ne',
  'Ar(g)': 'Ar',
  'Kr(g)': 'Kr',
  'Xe(g)': 'Xe',
  'F(g)': 'F',
  'F2(g)': 'F2',
  'HF(g)': 'HF',
  'Cl(g)': 'CL',
  'Cl2(g)': 'CL2',
  'HCl(g)': 'HCL',
  'Br(g)': 'Br',
  'Br2(g)': 'Br2',
  'HBr(g)': 'HBr',
  'I(g)': 'I',
  'I2(g)': 'I2',
  'HI(g)': 'HI',
  'S(g)': 'S',
  'S2(g)': 'S2',
  'SO2(g)': 'SO2',
  'SO3(g)': 'SO3',
  'H2S(g)': 'H2S',
  'N(g)': 'N',
  'N2(g)': 'N2',
  'NH3(g)': 'NH3',
  'NO(g)': 'NO',
  'NO2(g)': 'NO2',
  'N2O(g)': 'N2O',
  'N2O4(g)': 'N2O4',
  'HNO3(g)': 'HNO3',
  'H2O2(g)': 'H2O2',
  'P(g)': 'P',
  'P2(g)': 'P2',
  'P4(g)': 'P4',
  'C(g)': 'C',
  'CO(g)': 'CO',
  'CO2(g)': 'CO2',
  'Si(g)': 'Si',
  'SiF4(g)': 'SiF4',
  'Pb(g)': 'Pb',
  'B(g)': 'B',
  'BF3(g)': 'BF3',
  'Al(g)': 'AL',
  'Zn(g)': 'Zn',
  'Cu(g)': 'Cu',
  'Ti(g)': 'Ti',
  'TiCl4(g)': 'TiCL4',
  'Be(g)': 'Be',
  'Mg(g)': 'Mg',
  'Ca(g)': 'Ca',
  'Li(g)': 'Li',
  'Na(g)': 'Na',
  'K(g)': 'K',
  'Cs(g)': 'Cs',
  'Hg(g)': 'Hg',
  // gases: organics (Hill formula; descriptor where the library holds isomers in the same phase)
  'CH4(g)': 'CH4',
  'C2H6(g)': 'C2H6',
  'C2H4(g)': 'C2H4',
  'C2H2(g, ethyne)': 'C2H2,acetylene',
  'C3H8(g)': 'C3H8',
  'C4H10(g, butane)': 'C4H10,n-butane',
  'C5H12(g, pentane)': 'C5H12,n-pentane',
  'C7H16(g)': 'C7H16,n-heptane',
  'C8H18(g, octane)': 'C8H18,n-octane',
  'C8H18(g, 2,2,4-trimethylpentane)': 'C8H18,isooctane',
  'C6H12(g, cyclohexane)': 'C6H12,cyclo-',
  'C6H6(g)': 'C6H6',
  'C7H8(g)': 'C7H8',
  'C8H8(g)': 'C8H8,styrene',
  'C8H10(g, ethylbenzene)': 'C8H10,ethylbenz',
  'C10H8(g)': 'C10H8,naphthale',
  'C6H5OH(g)': 'C6H5OH,phenol',
  'CH3OH(g)': 'CH3OH',
  'C2H6O(g, ethanol)': 'C2H5OH',
  'C3H8O(g, propan-1-ol)': 'C3H8O,1propanol',
  'C3H8O(g, propan-2-ol)': 'C3H8O,2propanol',
  'C2H4O(g, acetaldehyde)': 'CH3CHO,ethanal',
  'CH3COOH(g)': 'CH3COOH',
  'HCOOH(g)': 'HCOOH',
  'CH3CN(g)': 'CH3CN',
  'CH2Cl2(g)': 'CH2CL2',
  'CHCl3(g)': 'CHCL3',
  // liquids
  'H2O(l)': 'H2O(L)',
  'Br2(l)': 'Br2(L)',
  'Hg(l)': 'Hg(L)',
  'H2SO4(l)': 'H2SO4(L)',
  'C6H6(l)': 'C6H6(L)',
  'C7H8(l)': 'C7H8(L)',
  'C8H18(l, octane)': 'C8H18(L),n-octa',
  // solids: elements
  'C(cr, graphite)': 'C(gr)',
  'S(cr, rhombic)': 'S(cr1)',
  'P(cr, white)': 'P(cr)',
  'I2(cr)': 'I2(cr)',
  'Si(cr)': 'Si(cr)',
  'Pb(cr)': 'Pb(cr)',
  'B(cr)': 'B(b)',
  'Al(cr)': 'AL(cr)',
  'Zn(cr)': 'Zn(cr)',
  'Cu(cr)': 'Cu(cr)',
  'Ti(cr)': 'Ti(a)',
  'Be(cr)': 'Be(a)',
  'Mg(cr)': 'Mg(cr)',
  'Ca(cr)': 'Ca(a)',
  'Li(cr)': 'Li(cr)',
  'Na(cr)': 'Na(cr)',
  'K(cr)': 'K(cr)',
  'Cs(cr)': 'Cs(cr)',
  'Fe(cr)': 'Fe(a)',
  // solids: compounds
  'SiO2(cr, quartz)': 'SiO2(Lqz)',
  'PbO(cr, red)': 'PbO(rd)',
  'PbO2(cr)': 'PbO2(s)',
  'Al2O3(cr)': 'AL2O3(a)',
  'AlF3(cr)': 'ALF3(a)',
  'HgO(cr)': 'HgO(s)',
  'CuSO4(cr)': 'CuSO4(s)',
  'TiO2(cr, rutile)': 'TiO2(ru)',
  'BeO(cr)': 'BeO(a)',
  'MgO(cr)': 'MgO(s)',
  'MgF2(cr)': 'MgF2(s)',
  'CaO(cr)': 'CaO(s)',
  'NaCl(cr)': 'NaCL(s)',
  'KCl(cr)': 'KCL(s)',
  'NaOH(cr)': 'NaOH(a)',
  'KOH(cr)': 'KOH(a)',
  'Na2CO3(cr)': 'Na2CO3(I)',
  'K2CO3(cr)': 'K2CO3(s)',
  'CaCO3(cr, calcite)': 'CaCO3(caL)',
  'MgCO3(cr)': 'MgCO3(s)',
  'CaCl2(cr)': 'CaCL2(s)',
  'MgCl2(cr)': 'MgCL2(s)',
  'BaCl2(cr)': 'BaCL2(a)',
  'AlCl3(cr)': 'ALCL3(s)',
  'FeCl2(cr)': 'FeCL2(s)',
  'FeCl3(cr)': 'FeCL3(s)',
  'NH4Cl(cr)': 'NH4CL(a)',
  'Na2SO4(cr)': 'Na2SO4(V)',
  'K2SO4(cr)': 'K2SO4(a)',
  'CaSO4(cr)': 'CaSO4(s)',
  'MgSO4(cr)': 'MgSO4(s)',
  'ZnSO4(cr)': 'ZnSO4(a)',
  'FeSO4(cr)': 'FeSO4(s)',
  'Ca(OH)2(cr)': 'CaO2H2(s)',
  'Mg(OH)2(cr)': 'MgO2H2(s)',
  'Ba(OH)2(cr)': 'BaO2H2(s)',
  'Cu(OH)2(cr)': 'CuO2H2(s)',
  'Fe(OH)2(cr)': 'Fe(OH)2(s)',
  'Fe(OH)3(cr)': 'Fe(OH)3(s)',
  'Fe2(SO4)3(cr)': 'Fe2S3O12(s)',
  'FeO(cr)': 'FeO(s)',
  'Fe2O3(cr)': 'Fe2O3(s)',
  'Fe3O4(cr)': 'Fe3O4(s)',
  'CuO(cr)': 'CuO(s)',
  'Cu2O(cr)': 'Cu2O(s)',
  'Na2O(cr)': 'Na2O(c)',
  'K2O(cr)': 'K2O(s)',
  'BaO(cr)': 'BaO(s)',
  'CaF2(cr)': 'CaF2(a)',
  'NaF(cr)': 'NaF(s)',
  'KF(cr)': 'KF(s)',
  'NaBr(cr)': 'NaBr(s)',
  'NaI(cr)': 'NaI(s)',
  'LiCl(cr)': 'LiCL(s)',
  'LiOH(cr)': 'LiOH(s)',
  'Cr2O3(cr)': 'Cr2O3(s)',
  'FeS(cr)': 'FeS(a)',
  'FeS2(cr)': 'FeS2(s)',
  'PbS(cr)': 'PbS(s)',
  'PbCl2(cr)': 'PbCL2(s)',
  'Na2O2(cr)': 'Na2O2(a)',
  'KO2(cr)': 'KO2(s)',
  'P4O10(cr)': 'P4O10(s)',
  'SiC(cr)': 'SiC(b)',
};

interface ImportedModelLine {
  species: string;
  source: string;
  forms: { label: string; model: { ranges?: number[] } }[];
}

/**
 * Key → NASA label map: from the NASA import's models-nasa.jsonl when it exists (the form whose range
 * covers 298.15 K), else the provisional map above.
 */
export function nasaLabelsByKey(libraryDir: string): { labels: Map<string, string>; origin: 'import' | 'provisional' } {
  const file = join(libraryDir, 'models-nasa.jsonl');
  if (!existsSync(file)) return { labels: new Map(Object.entries(PROVISIONAL_NASA_LABELS)), origin: 'provisional' };
  const labels = new Map<string, string>();
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    if (line.trim() === '') continue;
    const model = JSON.parse(line) as ImportedModelLine;
    const form = model.forms.find((f) => f.model.ranges !== undefined && coversReferenceTemperature(f.model.ranges));
    if (form) labels.set(model.species, form.label);
  }
  return { labels, origin: 'import' };
}

/** Every entry of the copied NASA TM-4513 files (seeds/source-data/nasa-tm4513/), by the report's label. */
export function loadNasaEntries(): Map<string, NasaSourceEntry> {
  const { gas, condensed } = readNasaSource();
  const entries = new Map<string, NasaSourceEntry>();
  for (const entry of [...gas, ...condensed]) {
    if (entries.has(entry.label)) throw new Error(`${entry.file} line ${entry.line}: duplicate label ${entry.label}`);
    entries.set(entry.label, entry);
  }
  return entries;
}

/** The entry behind a key, or undefined when the NASA file does not hold the species at 298.15 K. */
export function nasaEntryFor(
  key: string,
  labels: Map<string, string>,
  entries: Map<string, NasaSourceEntry>,
): NasaSourceEntry | undefined {
  const label = labels.get(key);
  return label === undefined ? undefined : entries.get(label);
}
