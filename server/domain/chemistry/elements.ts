// Element symbols of the periodic table (IUPAC, 1–118). Instruments and spreadsheets write them
// in any case ("MN", "mn"); Meltwire stores the canonical form ("Mn").
export const ELEMENT_SYMBOLS = [
  'H', 'He', 'Li', 'Be', 'B', 'C', 'N', 'O', 'F', 'Ne', 'Na', 'Mg', 'Al', 'Si', 'P', 'S', 'Cl', 'Ar',
  'K', 'Ca', 'Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn', 'Ga', 'Ge', 'As', 'Se', 'Br', 'Kr',
  'Rb', 'Sr', 'Y', 'Zr', 'Nb', 'Mo', 'Tc', 'Ru', 'Rh', 'Pd', 'Ag', 'Cd', 'In', 'Sn', 'Sb', 'Te', 'I', 'Xe',
  'Cs', 'Ba', 'La', 'Ce', 'Pr', 'Nd', 'Pm', 'Sm', 'Eu', 'Gd', 'Tb', 'Dy', 'Ho', 'Er', 'Tm', 'Yb', 'Lu',
  'Hf', 'Ta', 'W', 'Re', 'Os', 'Ir', 'Pt', 'Au', 'Hg', 'Tl', 'Pb', 'Bi', 'Po', 'At', 'Rn',
  'Fr', 'Ra', 'Ac', 'Th', 'Pa', 'U', 'Np', 'Pu', 'Am', 'Cm', 'Bk', 'Cf', 'Es', 'Fm', 'Md', 'No', 'Lr',
  'Rf', 'Db', 'Sg', 'Bh', 'Hs', 'Mt', 'Ds', 'Rg', 'Cn', 'Nh', 'Fl', 'Mc', 'Lv', 'Ts', 'Og',
] as const;

export type ElementSymbol = (typeof ELEMENT_SYMBOLS)[number];

const BY_UPPER = new Map<string, ElementSymbol>(ELEMENT_SYMBOLS.map((symbol) => [symbol.toUpperCase(), symbol]));

/** The canonical symbol for any casing of a real element symbol, or undefined. */
export function normaliseElement(text: string): ElementSymbol | undefined {
  return BY_UPPER.get(text.trim().toUpperCase());
}

export function isElementSymbol(text: string): text is ElementSymbol {
  return BY_UPPER.get(text.toUpperCase()) === text;
}
