import { describe, expect, it } from 'vitest';
import type { ImportPreview } from '../../../../src/features/imports/api/imports.ts';
import { importPlan } from '../../../../src/features/imports/import-plan.ts';

function preview(counts: Partial<ImportPreview['counts']>, rejectedLines: number[] = [], duplicate: string | null = null): ImportPreview {
  return {
    layout: { encoding: 'utf-8', delimiter: ',', decimal_separator: '.', layout: 'wide', time_zone: null, columns: [] },
    counts: { rows: 0, samples: 2, burns: 5, values: 15, samples_with_rejected_lines: 0, ...counts },
    samples: [],
    warnings: [],
    rejected: rejectedLines.map((line) => ({ line, column: 'Mn %', message: 'bad', code: 'invalid_value' })),
    duplicate_of: duplicate,
  };
}

describe('what an import will do, in words', () => {
  it('a clean file: how many samples, burns and values are added, as drafts', () => {
    const plan = importPlan(preview({}), 'all_or_nothing');
    expect(plan).toMatchObject({ canProceed: true, button: 'Import 2 samples', title: '2 samples will be stored' });
    expect(plan.text).toMatch(/^2 samples \(5 burns, 15 values\) will be added to the lab's results\. They are stored as drafts/);
    expect(importPlan(preview({ samples: 1, burns: 1, values: 1 }), 'per_sample').button).toBe('Import 1 sample');
    expect(importPlan(preview({ samples: 6667 }), 'all_or_nothing').button).toBe('Import 6,667 samples');
  });

  it('an unreadable line: the whole file would be refused, sample by sample leaves out the sample or the line', () => {
    const broken = preview({ samples: 3, samples_with_rejected_lines: 1 }, [3, 3]);
    expect(importPlan(broken, 'all_or_nothing')).toMatchObject({ canProceed: false, title: 'This file would be refused whole' });
    expect(importPlan(broken, 'all_or_nothing').text).toContain('1 line cannot be read');
    expect(importPlan(broken, 'per_sample')).toMatchObject({ canProceed: true, button: 'Import 2 samples, leave out 1 sample' });
    const orphanLines = preview({ samples: 2 }, [6, 7]);
    expect(importPlan(orphanLines, 'per_sample').button).toBe('Import 2 samples, leave out 2 lines');
    expect(importPlan(orphanLines, 'per_sample').text).toContain('The 2 lines that cannot be read are left out');
  });

  it('nothing to store, or stored before', () => {
    expect(importPlan(preview({ samples: 1, samples_with_rejected_lines: 1 }, [2]), 'per_sample').canProceed).toBe(false);
    expect(importPlan(preview({}, [], 'imp_1'), 'all_or_nothing')).toMatchObject({ canProceed: true, button: 'Show the earlier import' });
  });
});
