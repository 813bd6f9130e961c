// Names Meltwire never accepts as keys of client data. A JSON object can carry "__proto__" as an
// own key, but JavaScript code that copies it with assignment (`obj[key] = …`, Object.assign,
// zod's records) silently drops it or replaces the object's prototype instead. Refusing it with a
// 400 is clearer than losing it. Other Object members ("constructor", "toString") are ordinary
// names: code reading client keys uses Object.hasOwn or a Map, never a plain lookup.
export const RESERVED_KEYS: ReadonlySet<string> = new Set(['__proto__']);

export function isReservedKey(key: string): boolean {
  return RESERVED_KEYS.has(key);
}
