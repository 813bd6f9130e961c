// OpenAPI (JSON Schema) → fast-check arbitraries of valid-shaped values. "Valid-shaped" means the
// right types, lengths and enums, with names that mean something filled from the lab's real data
// (an `instrument_id` is usually an instrument's id, `values` keys are element symbols), so that a
// good share of the generated requests get past validation and into the services.
import fc from 'fast-check';
import { ELEMENT_SYMBOLS } from '../../../server/domain/chemistry/elements.ts';

export interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: JsonSchema | boolean;
  items?: JsonSchema;
  enum?: unknown[];
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  minItems?: number;
  maxItems?: number;
  format?: string;
  pattern?: string;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  $ref?: string;
  example?: unknown;
}

export interface Vocabulary {
  schemas: Record<string, JsonSchema>;
  /** Existing ids by table. */
  ids: Record<string, string[]>;
  emails: string[];
}

/** Property names whose values are ids of a table. */
const ID_TABLES: Record<string, string[]> = {
  instrument_id: ['instruments'],
  instrument_ids: ['instruments'],
  method_id: ['methods'],
  profile_id: ['import_profiles'],
  import_id: ['imports'],
  reference_material_id: ['reference_materials'],
  correction_set_id: ['standardizations'],
  caller_id: ['users', 'api_keys'],
  actor_id: ['users', 'api_keys'],
  target_id: ['samples', 'users', 'api_keys', 'methods'],
};

export const elementSymbol = fc.oneof(
  fc.constantFrom('C', 'Mn', 'Si', 'Cr', 'Ni', 'Mo', 'Cu', 'Fe', 'Al', 'S', 'P'),
  fc.constantFrom(...ELEMENT_SYMBOLS),
  fc.constantFrom('MN', 'mn', 'cr', 'SI'),
);

// Mostly past times (measurements cannot be in the future), sometimes future ones (expiry, schedules).
const isoTime = fc
  .oneof(
    { weight: 3, arbitrary: fc.date({ min: new Date('2020-01-01T00:00:00Z'), max: new Date(), noInvalidDate: true }) },
    fc.date({ min: new Date(Date.now() + 86_400_000), max: new Date('2035-12-31T00:00:00Z'), noInvalidDate: true }),
  )
  .map((d) => d.toISOString());

const email = fc.stringMatching(/^[a-z][a-z0-9]{0,10}$/).map((local) => `${local}@kestrelbend.test`);

/** Burn values: numbers and the strings instruments write. */
const measuredValue = fc.oneof(
  fc.double({ min: 0, max: 5, noNaN: true }),
  fc.constantFrom('0.75', '<0.0005', '>1.5', 'n.d.', '0.012', '1e-3'),
);

/** Plain text most requests would carry: letters, digits, a few separators. */
const plainText = (minLength: number, maxLength: number) =>
  fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9 ._-]*$/).filter((text) => text.length >= Math.max(minLength, 1) && text.length <= maxLength);

export function resolve(schema: JsonSchema, vocabulary: Vocabulary): JsonSchema {
  let current = schema;
  for (let i = 0; current.$ref && i < 20; i += 1) {
    const { $ref, ...rest } = current;
    current = { ...vocabulary.schemas[$ref.split('/').pop()!], ...rest };
  }
  if (current.allOf) {
    const { allOf, ...rest } = current;
    return allOf.reduce<JsonSchema>((merged, part) => ({ ...merged, ...resolve(part, vocabulary) }), rest);
  }
  return current;
}

function idArbitrary(tables: string[], vocabulary: Vocabulary): fc.Arbitrary<string> {
  const known = tables.flatMap((table) => vocabulary.ids[table] ?? []);
  const made = fc.constantFrom('ins_00000000000000000000000000', 'x', 'mth_unknown');
  return known.length ? fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...known) }, made) : made;
}

function stringArbitrary(schema: JsonSchema, name: string, vocabulary: Vocabulary): fc.Arbitrary<string> {
  const minLength = schema.minLength ?? 0;
  const maxLength = Math.max(minLength, Math.min(schema.maxLength ?? 40, 40));
  if (schema.format === 'date-time') return isoTime;
  if (schema.format === 'email') return fc.oneof(fc.constantFrom(...vocabulary.emails), email);
  if (ID_TABLES[name]) return idArbitrary(ID_TABLES[name], vocabulary);
  if (name === 'element' || name === 'matrix') return elementSymbol;
  const likely: fc.Arbitrary<string>[] = [plainText(minLength, maxLength)];
  if (typeof schema.example === 'string') likely.push(fc.constant(schema.example));
  if (name === 'unit' || name === 'default_unit') likely.push(fc.constantFrom('%', 'ppm', 'ppb', 'mg/kg', 'wt%', 'mass fraction'));
  if (schema.pattern) {
    try {
      const pattern = new RegExp(schema.pattern);
      likely[0] = fc.stringMatching(pattern).filter((s) => s.length >= minLength && s.length <= (schema.maxLength ?? 200));
    } catch {
      // A pattern JavaScript cannot read: plain text only.
    }
  }
  return fc.oneof({ weight: 4, arbitrary: fc.oneof(...likely) }, fc.string({ minLength, maxLength }));
}

function numberArbitrary(schema: JsonSchema, integer: boolean): fc.Arbitrary<number> {
  const min = schema.minimum ?? (integer ? -5 : 0);
  const max = schema.maximum ?? (integer ? 1000 : 5);
  if (integer) return fc.integer({ min: Math.ceil(min), max: Math.floor(max) });
  return fc.oneof(fc.double({ min, max, noNaN: true, noDefaultInfinity: true }), fc.integer({ min: Math.ceil(min), max: Math.floor(max) }));
}

/** Values of one JSON type (`schema` already resolved). */
function typed(type: string, schema: JsonSchema, name: string, vocabulary: Vocabulary, depth: number): fc.Arbitrary<unknown> {
  switch (type) {
    case 'string':
      return stringArbitrary(schema, name, vocabulary);
    case 'integer':
    case 'number':
      return numberArbitrary(schema, type === 'integer');
    case 'boolean':
      return fc.boolean();
    case 'null':
      return fc.constant(null);
    case 'array': {
      const items = schema.items ? arbitraryFor(schema.items, vocabulary, name, depth + 1) : fc.anything();
      const minLength = schema.minItems ?? 0;
      return fc.array(items, { minLength, maxLength: Math.max(minLength, Math.min(schema.maxItems ?? 3, 3)) });
    }
    case 'object':
      return objectArbitrary(schema, name, vocabulary, depth);
    default:
      return fc.anything();
  }
}

function objectArbitrary(schema: JsonSchema, name: string, vocabulary: Vocabulary, depth: number): fc.Arbitrary<unknown> {
  if (schema.properties) {
    const shape = Object.fromEntries(
      Object.entries(schema.properties).map(([key, value]) => [key, arbitraryFor(value, vocabulary, key, depth + 1)]),
    );
    return fc.record(shape, { requiredKeys: (schema.required ?? []).filter((key) => key in shape) });
  }
  if (typeof schema.additionalProperties === 'object') {
    if (name === 'values') return fc.dictionary(elementSymbol, measuredValue, { minKeys: 1, maxKeys: 5 });
    const key = fc.oneof({ weight: 3, arbitrary: fc.constantFrom('furnace', 'customer_order', 'ladle') }, fc.string({ maxLength: 12 }));
    return fc.dictionary(key, arbitraryFor(schema.additionalProperties, vocabulary, `${name}[]`, depth + 1), { maxKeys: 4 });
  }
  return fc.object({ maxDepth: 1 });
}

/** Valid-shaped values of `schema`; `name` is the property the value sits under. */
export function arbitraryFor(schema: JsonSchema, vocabulary: Vocabulary, name = '', depth = 0): fc.Arbitrary<unknown> {
  const resolved = resolve(schema, vocabulary);
  if (depth > 8) return fc.constant(null);
  if (resolved.enum) return fc.constantFrom(...resolved.enum);
  const alternatives = resolved.anyOf ?? resolved.oneOf;
  if (alternatives) return fc.oneof(...alternatives.map((s) => arbitraryFor(s, vocabulary, name, depth)));
  const types = Array.isArray(resolved.type) ? resolved.type : resolved.type ? [resolved.type] : [];
  if (types.length === 0) return resolved.properties ? objectArbitrary(resolved, name, vocabulary, depth) : fc.anything();
  return fc.oneof(...types.map((type) => typed(type, resolved, name, vocabulary, depth)));
}
