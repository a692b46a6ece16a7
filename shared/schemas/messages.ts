// Every validation message a person can see, in their words and naming the field by its label.
// Installed once for zod as a whole (client and server alike): a schema's own message still wins,
// and any check that has none gets one of these instead of zod's "Invalid input: expected …".
// Each shared schema file imports this module, so no parse can run before it is installed.
import { z } from 'zod';
import { fieldLabel } from './field-labels';

type Issue = z.core.$ZodRawIssue;

const count = (n: number | bigint) => Number(n).toLocaleString('en-GB');

function typeMessage(label: string, expected: string, input: unknown): string {
  if (input === undefined || input === null || input === '') return `${label} is missing`;
  switch (expected) {
    case 'number':
      return typeof input === 'number' ? `${label} must be a finite number` : `${label} must be a number`;
    case 'int':
      return `${label} must be a whole number`;
    case 'string':
      return `${label} must be text`;
    case 'boolean':
      return `${label}: choose yes or no`;
    case 'array':
    case 'tuple':
      return `${label}: choose from the list`;
    default:
      return `${label} is not filled in correctly`;
  }
}

function sizeMessage(label: string, issue: Issue & { code: 'too_small' | 'too_big' }): string {
  const small = issue.code === 'too_small';
  const bound = count(small ? issue.minimum : issue.maximum);
  switch (issue.origin) {
    case 'string':
      if (small) return Number(issue.minimum) <= 1 ? `${label} is empty` : `${label} needs at least ${bound} characters`;
      return `${label} is too long (at most ${bound} characters)`;
    case 'array':
    case 'set':
      if (small) return Number(issue.minimum) <= 1 ? `${label}: choose at least one` : `${label}: choose at least ${bound}`;
      return `${label}: at most ${bound}`;
    default:
      if (small) return issue.inclusive ? `${label} must be at least ${bound}` : `${label} must be above ${bound}`;
      return issue.inclusive ? `${label} must be at most ${bound}` : `${label} must be below ${bound}`;
  }
}

function formatMessage(label: string, format: string): string {
  switch (format) {
    case 'datetime':
      return `${label} must be a date and time`;
    case 'date':
      return `${label} must be a date (year-month-day)`;
    case 'email':
      return `${label} must be an e-mail address, like name@example.com`;
    default:
      return `${label} is not in a form Hotwell accepts`;
  }
}

/** The message for one zod issue, naming the field by the label a person sees. */
export function plainMessage(issue: Issue): string {
  const path = issue.path ?? [];
  if (!path.length && issue.code === 'invalid_type') return 'The request is not a filled-in form; reload the page and try again';
  // A schema may name itself (`.meta({ title })`) where its field name is shared by different things.
  const own = (issue as { schema?: z.ZodType }).schema;
  const title = own ? z.globalRegistry.get(own)?.title : undefined;
  const label = title ?? (fieldLabel(path) || 'The form');
  // A box left empty is missing, whatever check it then fails (a format, a minimum, a choice).
  if (issue.input === '' && issue.code !== 'custom') return `${label} is missing`;
  // A record picked from a list (crewId, ownerId…) that was not picked arrives as 0.
  const name = String(path.at(-1) ?? '');
  if (issue.code === 'too_small' && issue.origin === 'number' && /Id$/.test(name)) return `${label}: choose one`;
  switch (issue.code) {
    case 'invalid_type':
      return typeMessage(label, issue.expected, issue.input);
    case 'too_small':
    case 'too_big':
      return sizeMessage(label, issue);
    case 'invalid_format':
      return formatMessage(label, issue.format);
    case 'invalid_value':
      return issue.input === undefined ? `${label}: choose one` : `${label}: choose one of the offered options`;
    case 'unrecognized_keys':
    case 'invalid_key':
      return `${label} holds something this form does not send; reload the page and try again`;
    case 'not_multiple_of':
      return `${label} must be a multiple of ${String(issue.divisor)}`;
    default:
      return `${label} is not valid`;
  }
}

z.config({ customError: plainMessage });
