// A person's decision for a column the server flagged (layout.columns[].attention), and how the
// decisions become an import profile: ignore → ignore_columns, another element → element_columns,
// an identification field → columns.fields, keep the reading → keep_columns.
import type { ImportProfile } from '../../api/lookups.ts';
import type { ImportPreview } from './api/imports.ts';

export type PreviewColumn = ImportPreview['layout']['columns'][number];
export type AttentionCode = NonNullable<PreviewColumn['attention']>['code'];

export type ColumnDecision =
  { action: 'ignore' } | { action: 'element'; element: string } | { action: 'field'; key: string } | { action: 'keep' };

/** Columns whose reading must be decided before the console imports the file. */
export const BLOCKING_ATTENTION: readonly AttentionCode[] = ['computed_index', 'balance_element'];

export const needsDecision = (column: PreviewColumn) => column.attention !== undefined;
export const blocksImport = (column: PreviewColumn) => column.attention !== undefined && BLOCKING_ATTENTION.includes(column.attention.code);

const ATTENTION_CODES: readonly string[] = ['computed_index', 'balance_element', 'not_in_method'] satisfies AttentionCode[];

/** A warning the server gives for a column to decide (the same text as the column's attention). */
export const isColumnReviewWarning = (issue: { code: string }) => ATTENTION_CODES.includes(issue.code);

const FIELD_KEY = /^[a-z][a-z0-9_]{0,39}$/;

/** A field key for a header, as the profile accepts it: "CE %" → "carbon_equivalent", "Cast station" → "cast_station". */
export function suggestedFieldKey(column: PreviewColumn): string {
  if (column.attention?.code === 'computed_index') return 'carbon_equivalent';
  const key = column.header
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^[^a-z]+|_+$/g, '')
    .slice(0, 40);
  return key || 'column';
}

/** What is wrong with a decision, in words; null when it can be saved. */
export function decisionProblem(decision: ColumnDecision | undefined): string | null {
  if (!decision) return 'Choose what to do with this column.';
  if (decision.action === 'element' && !/^[A-Za-z]{1,2}$/.test(decision.element.trim())) return 'Give an element symbol, such as Cr.';
  if (decision.action === 'field' && !FIELD_KEY.test(decision.key))
    return 'Name the field with lower-case letters, digits and _ (starting with a letter).';
  return null;
}

type ProfileDecisions = Pick<ImportProfile, 'ignore_columns' | 'element_columns' | 'columns' | 'keep_columns'>;

/** The profile's per-column lists with the decisions added (a new profile starts from none). */
export function withDecisions(
  profile: ProfileDecisions | undefined,
  decisions: { column: PreviewColumn; decision: ColumnDecision }[],
): ProfileDecisions {
  const next: ProfileDecisions = {
    ignore_columns: [...(profile?.ignore_columns ?? [])],
    element_columns: [...(profile?.element_columns ?? [])],
    columns: { ...(profile?.columns ?? {}), fields: { ...(profile?.columns.fields ?? {}) } },
    keep_columns: [...(profile?.keep_columns ?? [])],
  };
  for (const { column, decision } of decisions) {
    if (decision.action === 'ignore') next.ignore_columns.push(column.header);
    else if (decision.action === 'keep') next.keep_columns.push(column.header);
    else if (decision.action === 'field') next.columns.fields![decision.key] = column.header;
    else {
      const unit = column.unit as ImportProfile['element_columns'][number]['unit'];
      next.element_columns.push({ header: column.header, element: decision.element.trim(), ...(unit ? { unit } : {}) });
    }
  }
  if (Object.keys(next.columns.fields!).length === 0) delete next.columns.fields;
  return next;
}
