// Hostile values and the mutations that put them into valid-shaped bodies: wrong types, huge and
// odd strings, prototype names as keys and values, deep nesting, numbers JSON can write but
// JavaScript cannot keep (1e309, -0, 1e-400), missing and extra fields.
import fc from 'fast-check';

/** JSON text inserted verbatim by toJsonText (numbers JSON.stringify cannot write, very deep nesting). */
export class RawJson {
  constructor(readonly text: string) {}
}

export const PROTOTYPE_NAMES = ['constructor', '__proto__', 'toString', 'valueOf', 'hasOwnProperty'] as const;

export function nestedArrays(depth: number): RawJson {
  return new RawJson(`${'['.repeat(depth)}${']'.repeat(depth)}`);
}

export function nestedObjects(depth: number): RawJson {
  return new RawJson(`${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`);
}

/** JSON text of a value that may contain RawJson parts (and own `__proto__` keys, which JSON.stringify keeps). */
export function toJsonText(value: unknown): string {
  if (value instanceof RawJson) return value.text;
  if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? 'null' : toJsonText(v))).join(',')}]`;
  if (value && typeof value === 'object') {
    const parts = Object.entries(value).flatMap(([k, v]) => (v === undefined ? [] : [`${JSON.stringify(k)}:${toJsonText(v)}`]));
    return `{${parts.join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/** An object with an own property of this name, even `__proto__`. */
export function own(key: string, value: unknown): Record<string, unknown> {
  return { [key]: value };
}

const RAW_NUMBERS = ['-0', '1e308', '1e309', '-1e309', '1e-400', '123456789012345678901234567890', '0.1e-7', '-1'].map(
  (t) => new RawJson(t),
);

export const hostileString: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(...PROTOTYPE_NAMES),
  fc.constantFrom('', ' ', 'NaN', 'Infinity', '-0', '1e308', '1e-400', '0x10', '<', '>', 'n.d.', '=cmd|/c calc', '%ZZ', '../..', '\u0000'),
  fc.constantFrom('\uD800', '\uDFFF', '\u202Eabc', 'ǅ', 'İ', '😀'.repeat(50), 'e\u0301'),
  fc.string({ unit: 'binary', maxLength: 30 }),
  fc.string({ unit: 'grapheme', maxLength: 30 }),
  fc.integer({ min: 1000, max: 200_000 }).map((n) => 'x'.repeat(n)),
);

export const hostileKey: fc.Arbitrary<string> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...PROTOTYPE_NAMES) },
  fc.constantFrom('', ' ', 'a.b', 'a[0]', '$where', 'x'.repeat(300)),
  fc.string({ unit: 'binary', maxLength: 12 }),
);

export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  hostileString,
  fc.constantFrom(null, true, false, 0, 1.5, -1, Number.MAX_SAFE_INTEGER + 2, 1e308, -1e-300, [], {}),
  fc.constantFrom(...RAW_NUMBERS),
  fc.constantFrom(...PROTOTYPE_NAMES).map((name) => own(name, 'x')),
  fc.constantFrom(...PROTOTYPE_NAMES).map((name) => own(name, { polluted: true })),
  fc.constantFrom(10, 63, 64, 65, 200, 5_000, 20_000).chain((depth) => fc.constantFrom(nestedArrays(depth), nestedObjects(depth))),
  fc.array(hostileString, { maxLength: 3 }),
  fc.anything({ maxDepth: 3 }),
);

type Mutation =
  | { kind: 'replace'; at: number; value: unknown }
  | { kind: 'drop'; at: number }
  | { kind: 'extra'; at: number; key: string; value: unknown };

export const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('replace' as const), at: fc.nat(), value: hostileValue }) },
  fc.record({ kind: fc.constant('drop' as const), at: fc.nat() }),
  fc.record({ kind: fc.constant('extra' as const), at: fc.nat(), key: hostileKey, value: hostileValue }),
);

type Container = Record<string, unknown> | unknown[];
interface Slot {
  parent: Container | null;
  key: string | number;
  value: unknown;
}

/** Every position in a JSON value: the root and each property or element under it. */
function slots(root: unknown): Slot[] {
  const found: Slot[] = [{ parent: null, key: '', value: root }];
  for (let i = 0; i < found.length; i += 1) {
    const { value } = found[i];
    if (Array.isArray(value)) value.forEach((v, k) => found.push({ parent: value, key: k, value: v }));
    else if (value && typeof value === 'object' && !(value instanceof RawJson))
      for (const [k, v] of Object.entries(value)) found.push({ parent: value as Record<string, unknown>, key: k, value: v });
  }
  return found;
}

/** Applies mutations in order to a copy of `value`; returns the mutated value. */
export function mutate(value: unknown, mutations: Mutation[]): unknown {
  let root = structuredClone(value);
  for (const original of mutations) {
    // Hostile values are shared between runs: each insertion gets its own copy.
    const m =
      'value' in original && !(original.value instanceof RawJson) ? { ...original, value: structuredClone(original.value) } : original;
    const all = slots(root);
    const slot = all[m.at % all.length];
    if (m.kind === 'extra') {
      const target = slot.value && typeof slot.value === 'object' && !(slot.value instanceof RawJson) ? slot.value : root;
      if (Array.isArray(target)) target.push(m.value);
      else if (target && typeof target === 'object')
        Object.defineProperty(target, m.key, { value: m.value, enumerable: true, configurable: true, writable: true });
      else root = own(m.key, m.value);
      continue;
    }
    const replacement = m.kind === 'replace' ? m.value : undefined;
    if (!slot.parent) root = replacement;
    else if (Array.isArray(slot.parent)) {
      if (m.kind === 'drop') slot.parent.splice(Number(slot.key), 1);
      else slot.parent[Number(slot.key)] = replacement;
    } else if (m.kind === 'drop') delete slot.parent[slot.key as string];
    else Object.defineProperty(slot.parent, slot.key, { value: replacement, enumerable: true, configurable: true, writable: true });
  }
  return root;
}
