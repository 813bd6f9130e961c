// How much text a sample may carry, wherever it comes from: the JSON push schema
// (samples.schemas.ts) and the file import (imports/parse/identity-limits.ts, cell-value.ts)
// apply the same limits.
export const SAMPLE_TEXT_LIMITS = {
  /** sample_code, heat and grade: characters after trimming. */
  identification: 100,
  /** An identification field's name (a column header in a file). */
  fieldName: 60,
  /** An identification field's value. */
  fieldValue: 500,
  /** Identification fields per sample. */
  fields: 30,
  /** An element value written as text ("<0.0005", "0,75"), as received. */
  value: 40,
} as const;
