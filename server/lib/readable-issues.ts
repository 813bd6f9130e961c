// Validation messages in plain words ("name must not be empty") instead of zod's defaults
// ("Too small: expected string to have >=1 characters"). Used as the per-parse error map, so a
// message a schema states itself still wins; errors[] keeps each field's location and zod code.
import type { z, ZodType } from 'zod';
import { ValidationProblem, type FieldError } from './problems.ts';

type Issue = z.core.$ZodRawIssue;
type Part = 'params' | 'query' | 'body';

const FORMAT_NAMES: Record<string, string> = {
  email: 'an e-mail address',
  url: 'a URL',
  uuid: 'a UUID',
  datetime: 'an ISO 8601 date and time with a zone, such as 2026-03-14T09:30:00Z',
  date: 'an ISO 8601 date, such as 2026-03-14',
  time: 'an ISO 8601 time, such as 09:30:00',
  regex: 'in the documented format',
  starts_with: 'in the documented format',
  ends_with: 'in the documented format',
  includes: 'in the documented format',
};

const TYPE_NAMES: Record<string, string> = {
  int: 'a whole number',
  number: 'a number',
  string: 'text',
  boolean: 'true or false',
  array: 'a list',
  object: 'an object',
  bigint: 'a whole number',
  date: 'a date',
};

/** What the value is called in a sentence: its field name, or "the body" / "an item" at the top. */
function subjectOf(issue: Issue): string {
  const path = issue.path ?? [];
  const last = path.at(-1);
  if (last === undefined) return 'the value';
  if (typeof last === 'number') {
    const parent = path.at(-2);
    return parent === undefined ? `item ${last + 1}` : `${String(parent)}[${last}]`;
  }
  return String(last);
}

function countable(origin: unknown, n: number): string {
  const noun = origin === 'string' ? 'character' : origin === 'array' || origin === 'set' ? 'item' : 'entry';
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}

function tooSmall(subject: string, issue: Extract<Issue, { code: 'too_small' }>): string {
  const min = Number(issue.minimum);
  if ((issue.origin === 'string' || issue.origin === 'array' || issue.origin === 'set') && min === 1 && issue.inclusive !== false)
    return `${subject} must not be empty`;
  if (issue.origin === 'string' || issue.origin === 'array' || issue.origin === 'set')
    return `${subject} must have at least ${countable(issue.origin, min)}`;
  return `${subject} must be ${issue.inclusive === false ? 'greater than' : 'at least'} ${String(issue.minimum)}`;
}

function tooBig(subject: string, issue: Extract<Issue, { code: 'too_big' }>): string {
  const max = Number(issue.maximum);
  if (issue.origin === 'string' || issue.origin === 'array' || issue.origin === 'set')
    return `${subject} must have at most ${countable(issue.origin, max)}`;
  return `${subject} must be ${issue.inclusive === false ? 'less than' : 'at most'} ${String(issue.maximum)}`;
}

const quoted = (values: readonly unknown[]) => values.map((v) => JSON.stringify(v)).join(', ');

/** The plain-words message for one issue, or undefined to keep zod's own (unusual codes). */
export function readableIssueMessage(issue: Issue): string | undefined {
  const subject = subjectOf(issue);
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined) return `${subject} is required`;
      return `${subject} must be ${TYPE_NAMES[issue.expected] ?? issue.expected}`;
    case 'too_small':
      return tooSmall(subject, issue);
    case 'too_big':
      return tooBig(subject, issue);
    case 'invalid_format':
      return `${subject} must be ${FORMAT_NAMES[issue.format] ?? `a valid ${issue.format}`}`;
    case 'invalid_value':
      return issue.values.length === 1 ? `${subject} must be ${quoted(issue.values)}` : `${subject} must be one of ${quoted(issue.values)}`;
    case 'unrecognized_keys':
      return `${issue.keys.length === 1 ? 'unknown field' : 'unknown fields'} ${quoted(issue.keys)}: ${subject === 'the value' ? 'the object' : subject} does not take ${issue.keys.length === 1 ? 'it' : 'them'}`;
    case 'not_multiple_of':
      return `${subject} must be a multiple of ${String(issue.divisor)}`;
    case 'invalid_union':
      return `${subject} does not match any of the accepted forms`;
    case 'invalid_key':
      return `${subject} has a key that is not allowed`;
    case 'invalid_element':
      return `${subject} holds a value that is not allowed`;
    default:
      return undefined;
  }
}

/** Parses with the plain-words messages; a failure becomes a 400 problem whose errors[] name each field under `part`. */
export function parseOrProblem<S extends ZodType>(part: Part, schema: S, value: unknown, detail?: string): z.output<S> {
  const result = schema.safeParse(value, { error: readableIssueMessage });
  if (result.success) return result.data;
  throw new ValidationProblem(fieldErrorsOf(part, result.error), detail);
}

export function fieldErrorsOf(part: Part, error: z.ZodError): FieldError[] {
  return error.issues.map((issue) => ({
    location: [part, ...issue.path.map(String)].join('.'),
    message: issue.message,
    code: issue.code,
  }));
}
