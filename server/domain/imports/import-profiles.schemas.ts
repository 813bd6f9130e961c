// Import profiles: how to read one family of result files. One zod schema validates the
// request, documents it in OpenAPI and types the parser's options.
import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { normaliseElement } from '../chemistry/elements.ts';
import { parseUnit, UNITS } from '../chemistry/units.ts';
import { describeHeaderAliases } from './parse/header-aliases.ts';
import { TIME_FORMATS, UTC_OFFSET_PATTERN } from './parse/times.ts';
import { isTimeZone } from './parse/zoned-time.ts';
import { checkProfileRules } from './import-profiles.rules.ts';

export const AUTO_DETECTION_DESCRIPTION =
  'Without a profile (and for whatever a profile leaves open) the parser detects: the encoding (UTF-8 with or without BOM, else Windows-1252); ' +
  'the delimiter (`,` `;` or tab: the one that splits the header into most columns and the data lines into as many); ' +
  'the decimal separator (`.` in comma-delimited files; otherwise `,` when more element cells write a digit-comma-digit than a digit-dot-digit); ' +
  'the header (the first non-blank line); the layout (long when an element column and a value column are named and no header is an element, else wide); ' +
  "element columns (a real element symbol in any case with an optional unit: `Mn`, `Mn %`, `%Mn`, `Mn [%]`, `C [ppm]`, `Si(%)`, `Cu mg/kg`; unit from the header, else the profile's default unit, else the caller's, else %); " +
  `identification headers, ignoring case and treating \`_ - . / :\` as spaces — ${describeHeaderAliases()}. ` +
  'Any other header becomes an identification field in `fields`. A header with a unit whose symbol is no element (`Xx %`) rejects the file.';

const HeaderName = z
  .string()
  .trim()
  .min(1)
  .max(200)
  .openapi({ description: 'A header as written in the file; matched ignoring case and surrounding spaces.', example: 'Heat No.' });

const ElementInput = z
  .string()
  .max(3)
  .transform(
    (value, ctx) => normaliseElement(value) ?? (ctx.addIssue({ code: 'custom', message: `"${value}" is not an element symbol` }), z.NEVER),
  )
  .openapi({ description: 'An element symbol in any case (`mn`, `MN` → `Mn`).', example: 'Mn' });

const UnitInput = z
  .string()
  .max(30)
  .transform(
    (value, ctx) =>
      parseUnit(value) ??
      (ctx.addIssue({ code: 'custom', message: `"${value}" is not a mass-fraction unit (%, ppm, mg/kg, ppb, µg/kg, mass fraction …)` }),
      z.NEVER),
  )
  .openapi({
    description:
      'A mass-fraction unit: `%` (also `wt%`), `ppm` (`mg/kg`), `ppb` (`µg/kg`, `ug/kg`) or `mass fraction`. Stored as `%`, `ppm`, `ppb` or `fraction`.',
    example: 'ppm',
  });

const FIELD_KEY_PATTERN = /^[a-z][a-z0-9_]{0,39}$/;
const RESERVED_FIELD_KEYS = ['sample_code', 'heat', 'grade', 'kind', 'burn_number', 'measured_at'];
const FieldKey = z
  .string()
  .regex(FIELD_KEY_PATTERN, 'must be lower-case letters, digits and _ (starting with a letter, at most 40)')
  .refine((key) => !RESERVED_FIELD_KEYS.includes(key), 'is a built-in column; map it under `columns` instead');

const ColumnsSchema = z
  .strictObject({
    sample_code: HeaderName.optional(),
    heat: HeaderName.optional(),
    grade: HeaderName.optional(),
    kind: HeaderName.optional(),
    burn_number: HeaderName.optional(),
    measured_at: HeaderName.optional(),
    fields: z
      .record(FieldKey, HeaderName)
      .optional()
      .openapi({ description: 'Other identification fields: key → header.', example: { furnace: 'Furnace', customer_order: 'Order' } }),
  })
  .openapi('ImportProfileColumns', { description: 'Which header holds what. Roles left out are recognised automatically.' });

const LongColumnsSchema = z
  .strictObject({ element: HeaderName, value: HeaderName, unit: HeaderName.optional() })
  // Left unnamed: zod-to-openapi drops `null` from a nullable reference to a named schema.
  .openapi({
    description: 'Long layout: the headers holding the element symbol, the value and (optionally) the unit; null for the wide layout.',
  });

const ElementColumnSchema = z
  .strictObject({ header: HeaderName, element: ElementInput, unit: UnitInput.optional() })
  .openapi('ImportProfileElementColumn', {
    description: 'Wide layout: a header that holds one element, for headers that are not a plain symbol.',
  });

const TimeSchema = z
  .strictObject({
    format: z.enum(TIME_FORMATS).default('auto').openapi({ description: '`auto` accepts each of the others.' }),
    time_zone: z
      .string()
      .max(64)
      .refine(isTimeZone, 'must be an IANA time zone name such as Europe/Berlin or America/Chicago')
      .nullable()
      .default(null)
      .openapi({
        description:
          "The instrument's time zone (IANA name): times written without an offset are read in it, daylight saving included. A time the clocks skip is refused; a time in the repeated hour is read as its first occurrence, with a warning.",
        example: 'Europe/Berlin',
      }),
    utc_offset: z.string().regex(UTC_OFFSET_PATTERN, 'must be Z or ±HH:MM between -14:00 and +14:00').nullable().default(null).openapi({
      description:
        "A fixed offset for times written without one, for instruments that keep one all year. With neither this nor `time_zone`, such times are read as UTC with a warning, and those within an hour of a correction set's start are refused (the set that applies cannot be told).",
      example: '+01:00',
    }),
  })
  .refine((time) => time.time_zone === null || time.utc_offset === null, {
    message: 'give either time_zone or utc_offset, not both',
    path: ['utc_offset'],
  })
  .openapi('ImportProfileTime');

/** Every field of a profile, none defaulted: the PATCH body is this, all optional. */
const fields = {
  name: z.string().trim().min(1).max(100).openapi({ example: 'OES-1 nightly export' }),
  description: z.string().trim().max(2000).nullable(),
  delimiter: z.enum([',', ';', 'tab', 'auto']),
  decimal_separator: z.enum(['.', ',', 'auto']),
  encoding: z.enum(['utf-8', 'windows-1252', 'auto']).openapi({ description: '`auto`: UTF-8 with or without BOM, else Windows-1252.' }),
  header_row: z.number().int().min(1).max(100).openapi({ description: '1-based line of the header; lines above it are skipped.' }),
  layout: z
    .enum(['wide', 'long'])
    .openapi({ description: '`wide`: a row per burn, a column per element. `long`: a row per element value.' }),
  columns: ColumnsSchema,
  long_columns: LongColumnsSchema.nullable(),
  element_columns: z.array(ElementColumnSchema).max(200),
  default_unit: UnitInput.nullable().openapi({
    description: "Unit of element columns whose header names none; null = the caller's default, else %.",
  }),
  ignore_columns: z.array(HeaderName).max(200),
  keep_columns: z.array(HeaderName).max(200).openapi({
    description:
      'Headers whose automatic reading the lab has confirmed (for example an element the method does not list, kept as measured): the import no longer warns about them.',
  }),
  time: TimeSchema,
};

export const CreateImportProfileRequestSchema = z
  .strictObject({
    ...fields,
    description: fields.description.default(null),
    delimiter: fields.delimiter.default('auto'),
    decimal_separator: fields.decimal_separator.default('auto'),
    encoding: fields.encoding.default('auto'),
    header_row: fields.header_row.default(1),
    layout: fields.layout.default('wide'),
    columns: ColumnsSchema.default({}),
    long_columns: fields.long_columns.default(null),
    element_columns: fields.element_columns.default([]),
    default_unit: fields.default_unit.default(null),
    ignore_columns: fields.ignore_columns.default([]),
    keep_columns: fields.keep_columns.default([]),
    time: TimeSchema.default({ format: 'auto', time_zone: null, utc_offset: null }),
  })
  .superRefine(checkProfileRules)
  .openapi('CreateImportProfileRequest', { description: AUTO_DETECTION_DESCRIPTION });

export type ImportProfileInput = z.output<typeof CreateImportProfileRequestSchema>;
/** The layout part of a profile: what the parser reads. */
export type ImportProfileDefinition = Omit<ImportProfileInput, 'name' | 'description'>;

export const UpdateImportProfileRequestSchema = z
  .strictObject(fields)
  .partial()
  .refine((value) => Object.keys(value).length > 0, 'give at least one field to change')
  .openapi('UpdateImportProfileRequest', { description: 'Top-level fields replace the stored ones; the result is validated as a whole.' });

export const ImportProfileSchema = z
  .object({
    id: z.string().openapi({ example: 'ipr_01jd9x4ck3m9y1n0qg7f2h6v5w' }),
    name: z.string(),
    description: z.string().nullable(),
    delimiter: fields.delimiter,
    decimal_separator: fields.decimal_separator,
    encoding: fields.encoding,
    header_row: z.number().int(),
    layout: fields.layout,
    columns: z.object({
      sample_code: z.string().optional(),
      heat: z.string().optional(),
      grade: z.string().optional(),
      kind: z.string().optional(),
      burn_number: z.string().optional(),
      measured_at: z.string().optional(),
      fields: z.record(z.string(), z.string()).optional(),
    }),
    long_columns: z.object({ element: z.string(), value: z.string(), unit: z.string().optional() }).nullable(),
    element_columns: z.array(z.object({ header: z.string(), element: z.string(), unit: z.enum(UNITS).optional() })),
    default_unit: z.enum(UNITS).nullable(),
    ignore_columns: z.array(z.string()),
    keep_columns: z.array(z.string()),
    time: z.object({ format: z.enum(TIME_FORMATS), time_zone: z.string().nullable(), utc_offset: z.string().nullable() }),
    revision: z.number().int().openapi({ description: 'Starts at 1; each change adds 1. Imports record the revision they used.' }),
    created_at: z.string().openapi({ format: 'date-time' }),
    updated_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('ImportProfile', { description: AUTO_DETECTION_DESCRIPTION });

export const ImportProfileListSchema = listOf(ImportProfileSchema, 'ImportProfileList');
export const ImportProfileListQuerySchema = paginationQuery;
export const ImportProfileIdParams = z.object({ id: z.string().min(1).max(40) });
