import { describe, expect, it } from 'vitest';
import { ELEMENT_SYMBOLS, isElementSymbol, normaliseElement } from '../../../server/domain/chemistry/elements.ts';

describe('element symbols (IUPAC periodic table, elements 1–118, names of 2016 for 113, 115, 117, 118)', () => {
  it('lists 118 distinct symbols in atomic-number order', () => {
    expect(ELEMENT_SYMBOLS).toHaveLength(118);
    expect(new Set(ELEMENT_SYMBOLS).size).toBe(118);
    // Spot checks by atomic number (IUPAC): 1 H, 6 C, 25 Mn, 26 Fe, 29 Cu, 82 Pb, 113 Nh, 118 Og.
    expect(ELEMENT_SYMBOLS[0]).toBe('H');
    expect(ELEMENT_SYMBOLS[5]).toBe('C');
    expect(ELEMENT_SYMBOLS[24]).toBe('Mn');
    expect(ELEMENT_SYMBOLS[25]).toBe('Fe');
    expect(ELEMENT_SYMBOLS[28]).toBe('Cu');
    expect(ELEMENT_SYMBOLS[81]).toBe('Pb');
    expect(ELEMENT_SYMBOLS[112]).toBe('Nh');
    expect(ELEMENT_SYMBOLS[117]).toBe('Og');
  });

  it('normalises any casing to the canonical symbol', () => {
    expect(normaliseElement('MN')).toBe('Mn');
    expect(normaliseElement('mn')).toBe('Mn');
    expect(normaliseElement('mN')).toBe('Mn');
    expect(normaliseElement(' fe ')).toBe('Fe');
    expect(normaliseElement('c')).toBe('C');
    expect(normaliseElement('CO')).toBe('Co'); // cobalt, not carbon + oxygen
    expect(normaliseElement('OG')).toBe('Og');
  });

  it('no symbol, in any casing, is the name of an Object member: element-keyed records need no own-property checks', () => {
    const members = new Set(Object.getOwnPropertyNames(Object.prototype));
    for (const symbol of ELEMENT_SYMBOLS) {
      for (const text of [symbol, symbol.toUpperCase(), symbol.toLowerCase()]) expect(members.has(text)).toBe(false);
    }
    for (const name of members) expect(normaliseElement(name)).toBeUndefined();
  });

  it('rejects what is not an element symbol', () => {
    for (const text of ['Xx', 'Mnn', 'M', 'J', 'Q', '', ' ', 'Mn%', 'Uuo', 'Fe2']) expect(normaliseElement(text)).toBeUndefined();
  });

  it('isElementSymbol accepts only the canonical casing', () => {
    expect(isElementSymbol('Mn')).toBe(true);
    expect(isElementSymbol('MN')).toBe(false);
    expect(isElementSymbol('mn')).toBe(false);
    expect(isElementSymbol('Xx')).toBe(false);
  });
});
