/**
 * The element symbols of the periodic table (Z = 1–118) with English names (IUPAC spelling),
 * plus the isotope symbols D (deuterium, ²H) and T (tritium, ³H), which the equation language
 * balances as symbols of their own. Symbols and names typed from memory; the test suite checks
 * the 118 symbols against the `chemical-elements` npm package.
 */
const TABLE = `H Hydrogen|He Helium|Li Lithium|Be Beryllium|B Boron|C Carbon|N Nitrogen|O Oxygen|F Fluorine|Ne Neon|Na Sodium|Mg Magnesium|Al Aluminium|Si Silicon|P Phosphorus|S Sulfur|Cl Chlorine|Ar Argon|K Potassium|Ca Calcium|Sc Scandium|Ti Titanium|V Vanadium|Cr Chromium|Mn Manganese|Fe Iron|Co Cobalt|Ni Nickel|Cu Copper|Zn Zinc|Ga Gallium|Ge Germanium|As Arsenic|Se Selenium|Br Bromine|Kr Krypton|Rb Rubidium|Sr Strontium|Y Yttrium|Zr Zirconium|Nb Niobium|Mo Molybdenum|Tc Technetium|Ru Ruthenium|Rh Rhodium|Pd Palladium|Ag Silver|Cd Cadmium|In Indium|Sn Tin|Sb Antimony|Te Tellurium|I Iodine|Xe Xenon|Cs Caesium|Ba Barium|La Lanthanum|Ce Cerium|Pr Praseodymium|Nd Neodymium|Pm Promethium|Sm Samarium|Eu Europium|Gd Gadolinium|Tb Terbium|Dy Dysprosium|Ho Holmium|Er Erbium|Tm Thulium|Yb Ytterbium|Lu Lutetium|Hf Hafnium|Ta Tantalum|W Tungsten|Re Rhenium|Os Osmium|Ir Iridium|Pt Platinum|Au Gold|Hg Mercury|Tl Thallium|Pb Lead|Bi Bismuth|Po Polonium|At Astatine|Rn Radon|Fr Francium|Ra Radium|Ac Actinium|Th Thorium|Pa Protactinium|U Uranium|Np Neptunium|Pu Plutonium|Am Americium|Cm Curium|Bk Berkelium|Cf Californium|Es Einsteinium|Fm Fermium|Md Mendelevium|No Nobelium|Lr Lawrencium|Rf Rutherfordium|Db Dubnium|Sg Seaborgium|Bh Bohrium|Hs Hassium|Mt Meitnerium|Ds Darmstadtium|Rg Roentgenium|Cn Copernicium|Nh Nihonium|Fl Flerovium|Mc Moscovium|Lv Livermorium|Ts Tennessine|Og Oganesson`;

const entries = TABLE.split('|').map((pair) => {
  const [symbol = '', name = ''] = pair.split(' ');
  return { symbol, name };
});

/** The 118 element symbols in order of atomic number (index 0 = H). */
export const ELEMENT_SYMBOLS: readonly string[] = entries.map((e) => e.symbol);

/** Isotope symbols balanced as their own symbols: deuterium and tritium. */
export const ISOTOPE_SYMBOLS: readonly string[] = ['D', 'T'];

const NAMES = new Map<string, string>([
  ...entries.map((e) => [e.symbol, e.name] as const),
  ['D', 'Deuterium'],
  ['T', 'Tritium'],
]);
const NUMBERS = new Map<string, number>(entries.map((e, i) => [e.symbol, i + 1] as const));

/** True for the 118 element symbols and for D and T. Case-sensitive ("Co" yes, "CO" no). */
export function isElementSymbol(symbol: string): boolean {
  return NAMES.has(symbol);
}

/** Atomic number of an element symbol; D and T give 1 (they are hydrogen); unknown → undefined. */
export function atomicNumber(symbol: string): number | undefined {
  if (symbol === 'D' || symbol === 'T') return 1;
  return NUMBERS.get(symbol);
}

/** English element name ("Oxygen"), or undefined for an unknown symbol. */
export function elementName(symbol: string): string | undefined {
  return NAMES.get(symbol);
}

// Non-metals and metalloids: used only to judge whether a trailing-sign charge reading looks
// likely (`Fe3+` read as Fe₃⁺ is unlikely; `O2-` read as superoxide O₂⁻ is fine). Common practice, no source.
const NON_METALS = new Set([
  'H',
  'D',
  'T',
  'He',
  'B',
  'C',
  'N',
  'O',
  'F',
  'Ne',
  'Si',
  'P',
  'S',
  'Cl',
  'Ar',
  'Ge',
  'As',
  'Se',
  'Br',
  'Kr',
  'Sb',
  'Te',
  'I',
  'Xe',
  'At',
  'Rn',
]);

/** True when the symbol is conventionally a metal (everything except non-metals and metalloids). */
export function isMetal(symbol: string): boolean {
  return NUMBERS.has(symbol) && !NON_METALS.has(symbol);
}
