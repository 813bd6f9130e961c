// What the server recognised a column as (ImportReport.layout.columns[].role), in words.
const ROLE_WORDS: Record<string, string> = {
  sample_code: 'Sample code',
  heat: 'Heat / lot',
  grade: 'Grade',
  kind: 'Sample kind',
  burn_number: 'Burn number',
  measured_at: 'Time measured',
  field: 'Identification field',
  element: 'Element',
  element_name: 'Element name',
  value: 'Value',
  unit: 'Unit',
  ignored: 'Ignored',
};

export function roleInWords(role: string): string {
  return ROLE_WORDS[role] ?? role.replaceAll('_', ' ');
}

/** Elements of a file in column order: the element columns of a wide file, else those the values name. */
export function elementsOf(columns: { role: string; element?: string }[], valueRecords: Record<string, string>[]): string[] {
  const elements = columns.filter((c) => c.role === 'element' && c.element).map((c) => c.element as string);
  const seen = new Set(elements);
  for (const record of valueRecords) {
    for (const el of Object.keys(record)) {
      if (seen.has(el)) continue;
      seen.add(el);
      elements.push(el);
    }
  }
  return elements;
}

/** How a column will be stored, as a sentence: "Element Mn, in %", "Field “furnace”", "Not imported". */
export function readingInWords(column: { role: string; element?: string; unit?: string; field?: string }): string {
  if (column.role === 'element') return `Element ${column.element ?? '?'}, in ${column.unit ?? '%'}`;
  if (column.role === 'field') return `Identification field “${column.field ?? ''}”`;
  if (column.role === 'value') return `Value, in ${column.unit ?? '%'} unless the unit column says otherwise`;
  if (column.role === 'ignored') return 'Not imported';
  return roleInWords(column.role);
}

/** Who decided the reading: the import profile, or the header as detected. */
export function decidedBy(column: { source?: string; kept?: boolean }): string {
  if (column.kept) return 'Confirmed in the profile';
  if (column.source === 'profile') return 'Import profile';
  return 'Detected from the header';
}
