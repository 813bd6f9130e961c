// Reads the burns typed into the run form: a JSON array of { element: value } objects.
export function parseBurnsJson(text: string): { burns?: Record<string, number | string>[]; error?: string } {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return { error: 'Not valid JSON. Write an array of burns, e.g. [{"C": 0.80, "Mn": 1.47}, {"C": 0.81, "Mn": 1.48}].' };
  }
  if (!Array.isArray(value) || value.length === 0) return { error: 'Write an array with at least one burn.' };
  for (const [i, burn] of value.entries()) {
    if (!burn || typeof burn !== 'object' || Array.isArray(burn)) return { error: `Burn ${i + 1} is not an object of element → value.` };
    for (const [element, cell] of Object.entries(burn)) {
      if (typeof cell !== 'number' && typeof cell !== 'string')
        return { error: `Burn ${i + 1}: the value of ${element} must be a number or a string such as "<0.002".` };
    }
  }
  return { burns: value as Record<string, number | string>[] };
}
