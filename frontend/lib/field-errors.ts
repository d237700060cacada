import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiProblem, type FieldProblem } from './api-client';

/**
 * Where a form shows each request field: the form's own field and the label a person reads, keyed
 * by the request field in dotted form ('source.citation' for /body/source/citation).
 */
export type FormFieldMap<T extends FieldValues> = Record<string, { name: Path<T>; label: string }>;

/** A request field as a person would name it when no form gives a label: 'source.citation' → 'Source citation'. */
export function labelOfField(field: string): string {
  const words = field
    .split('.')
    .filter((part) => !/^\d+$/.test(part))
    .join(' ')
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase();
  return words ? words[0]!.toUpperCase() + words.slice(1) : 'The request';
}

const plural = (n: string, one: string, many: string) => (n === '1' ? one : many);

/**
 * The JSON Schema validator's words (ajv, behind express-openapi-validator) in plain ones:
 * 'must NOT have fewer than 5 characters' → 'use at least 5 characters'. A message the service
 * wrote itself ('must lie in the future') is kept.
 */
export function plainPhrase(message: string): string {
  const rules: Array<[RegExp, (...m: string[]) => string]> = [
    [
      /^must NOT have fewer than (\d+) characters?$/,
      (n) => (n === '1' ? 'fill this in' : `use at least ${n} characters`),
    ],
    [/^must NOT have more than (\d+) characters?$/, (n) => `use at most ${n} characters`],
    [
      /^must NOT have fewer than (\d+) items?$/,
      (n) => `give at least ${n} ${plural(n, 'entry', 'entries')}`,
    ],
    [
      /^must NOT have more than (\d+) items?$/,
      (n) => `give at most ${n} ${plural(n, 'entry', 'entries')}`,
    ],
    [/^must be >= (\S+)$/, (n) => `enter ${n} or more`],
    [/^must be > (\S+)$/, (n) => `enter more than ${n}`],
    [/^must be <= (\S+)$/, (n) => `enter ${n} or less`],
    [/^must be < (\S+)$/, (n) => `enter less than ${n}`],
    [/^must have required property '.*'$/, () => 'this is required'],
    [/^must match format "email"$/, () => 'enter an e-mail address, such as name@example.com'],
    [/^must match format "(date-time|date)"$/, () => 'enter a date'],
    [/^must match format "uri"$/, () => 'enter a web address starting with https://'],
    [/^must match format "(.+)"$/, (f) => `this is not a valid ${f}`],
    [/^must be equal to one of the allowed values$/, () => 'choose one of the offered values'],
    [/^must be integer$/, () => 'enter a whole number'],
    [/^must be number$/, () => 'enter a number'],
    [/^must be string$/, () => 'enter text'],
    [/^must be boolean$/, () => 'choose yes or no'],
    [/^must match pattern "\\S"$/, () => 'fill this in (spaces alone do not count)'],
    [/^must match pattern ".*"$/, () => 'this is not in the expected form'],
    [/^must NOT have additional properties$/, () => 'this is not accepted here'],
    [/^must NOT have fewer than 1 properties$/, () => 'change at least one thing'],
  ];
  for (const [pattern, say] of rules) {
    const m = pattern.exec(message.trim());
    if (m) return say(...m.slice(1));
  }
  return message.trim();
}

/** One problem in plain words with its field's label: 'Source citation: use at least 5 characters.' */
export function plainMessage(message: string, label: string): string {
  return `${label}: ${plainPhrase(message).replace(/\.$/, '')}.`;
}

/** The field problems of any error (none unless it is an ApiProblem that names fields). */
export function fieldProblems(error: unknown): FieldProblem[] {
  return error instanceof ApiProblem ? error.fieldProblems : [];
}

/**
 * Puts the service's field problems on the form's fields (react-hook-form's setError), the first
 * problem of each field only, in plain words, and focuses the first field concerned. Problems
 * about fields the form does not show are left to <ProblemMessage fields={map}>, which skips the
 * ones placed here, so nothing is said twice.
 */
export function setFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: FormFieldMap<T>,
): void {
  const placed = new Set<string>();
  for (const p of fieldProblems(error)) {
    const target = fields[p.field];
    if (!target || placed.has(p.field)) continue;
    setError(
      target.name,
      // Beside the field, in the style of the form's own checks: a short phrase, no label.
      { type: 'server', message: plainPhrase(p.message).replace(/\.$/, '') },
      { shouldFocus: placed.size === 0 },
    );
    placed.add(p.field);
  }
}
