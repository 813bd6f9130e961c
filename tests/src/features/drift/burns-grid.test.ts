import { describe, expect, it } from 'vitest';
import {
  type BurnRow,
  burnsFromRows,
  emptyRows,
  isGridPaste,
  pasteIntoRows,
  sentRowIndexes,
} from '../../../../src/features/drift/burns-grid.ts';

describe('burns grid', () => {
  it('sends the rows that hold a value, trimmed, reading a decimal comma as a point', () => {
    const rows: BurnRow[] = [
      { C: ' 0.452 ', Mn: '1,498' },
      { C: '', Mn: ' ' },
      { C: '<0,002', Cr: 'n.d.' },
    ];
    expect(burnsFromRows(rows)).toEqual({
      burns: [
        { C: '0.452', Mn: '1.498' },
        { C: '<0.002', Cr: 'n.d.' },
      ],
    });
    expect(sentRowIndexes(rows)).toEqual([0, 2]);
    // A thousands separator is not a decimal comma: left for the server to refuse.
    expect(burnsFromRows([{ Mn: '1,498,2' }])).toEqual({ burns: [{ Mn: '1,498,2' }] });
  });

  it('says what to do when no burn holds a value', () => {
    expect(burnsFromRows(emptyRows()).error).toBe('Type at least one burn, or read the burns from the instrument’s file.');
  });

  it('spreads a spreadsheet paste over the cells from the one pasted into, adding rows as needed', () => {
    const elements = ['C', 'Si', 'Mn'];
    const pasted = pasteIntoRows([{ C: '0.1' }], 0, 'Si', '0.21\t0.70\t9\n0.22\t0.71\r\n', elements);
    expect(pasted).toEqual([
      { C: '0.1', Si: '0.21', Mn: '0.70' },
      { Si: '0.22', Mn: '0.71' },
    ]);
    expect(isGridPaste('0.452')).toBe(false);
    expect(isGridPaste('0.452\n')).toBe(false);
    expect(isGridPaste('0.452\t1.1')).toBe(true);
  });
});
