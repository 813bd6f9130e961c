// Element columns whose automatic reading is often wrong, named before anything is stored so a
// person decides (ignore, map or keep, saved in an import profile) instead of finding out later:
// - "CE" in capitals is the carbon equivalent, a computed index, far more often than cerium;
// - the method's base element (Fe on a steel method) is usually printed as the balance, 100 %
//   minus the rest, not a measured value;
// - an element the method does not list has no reporting precision, range or limit.
// Columns the profile reads itself (element_columns) or confirms (keep_columns) are decided.
import type { ColumnAttentionCode, ColumnRole, Issue } from './types.ts';

/** What the review needs to know of the method the file is imported under. */
export interface ReviewMethod {
  code: string;
  matrix: string;
  elements: string[];
  balance_by_difference: boolean;
  unlisted_elements: 'keep_unreported' | 'report';
}

/** The letters of a header before its unit ("CE %" → "CE", "%CE" → "CE", "CE [%]" → "CE"). */
function symbolLetters(header: string): string {
  return /[A-Za-z]{1,2}/.exec(header)?.[0] ?? '';
}

function attentionOf(column: ColumnRole, method: ReviewMethod): { code: ColumnAttentionCode; message: string } | null {
  const element = column.element!;
  const header = column.header;
  if (element === 'Ce' && symbolLetters(header) === 'CE') {
    return {
      code: 'computed_index',
      message: `"${header}" would be stored as cerium (Ce), but CE in capitals usually means the carbon equivalent, an index computed from other elements. Ignore it, keep it as an identification field, or confirm it is cerium.`,
    };
  }
  if (element === method.matrix) {
    const reported = method.balance_by_difference
      ? `The method reports ${element} by difference, so these values would only be kept with the burns.`
      : `Keeping it stores ${element} as a measured result.`;
    return {
      code: 'balance_element',
      message: `"${header}" holds ${element}, the base of method ${method.code}: instruments usually print it as the balance (100 % minus the other elements), not as a measured value. ${reported}`,
    };
  }
  if (!method.elements.includes(element)) {
    const treatment =
      method.unlisted_elements === 'report'
        ? 'it would be reported with 4 decimals and no range or limit'
        : 'its values would be kept with the burns but not reported';
    return {
      code: 'not_in_method',
      message: `"${header}" holds ${element}, which method ${method.code} does not list: ${treatment}. Ignore it, read it as another element or a field, or keep it.`,
    };
  }
  return null;
}

/** Marks each undecided element column that needs attention and returns one warning per column. */
export function reviewColumns(columns: ColumnRole[], method: ReviewMethod, line: number): Issue[] {
  const warnings: Issue[] = [];
  for (const column of columns) {
    if (column.role !== 'element' || column.source !== 'auto' || column.kept) continue;
    const attention = attentionOf(column, method);
    if (!attention) continue;
    column.attention = attention;
    warnings.push({ line, column: column.header, code: attention.code, message: attention.message });
  }
  return warnings;
}
