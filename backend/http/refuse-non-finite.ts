import type { RequestHandler } from 'express';
import { ProblemError, type FieldError } from './problem';

/** 'Infinity', '-infinity', 'NaN', '+nan': words that Number() and the validator's coercion turn into non-finite numbers. */
const NON_FINITE_WORD = /^\s*[+-]?(infinity|nan)\s*$/i;
/** A decimal numeral (what the validator would coerce to a number), e.g. 1e999. */
const NUMERAL = /^\s*[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?\s*$/i;

/** JSON pointer escaping (RFC 6901) of one key. */
const escapeKey = (key: string) => key.replace(/~/g, '~0').replace(/\//g, '~1');

function nonFiniteText(value: string): boolean {
  return NON_FINITE_WORD.test(value) || (NUMERAL.test(value) && !Number.isFinite(Number(value)));
}

/**
 * U+0000 in text: PostgreSQL's text type cannot hold it (the driver fails the query), SQLite would
 * store it. Refused here, so both databases answer the same 400 and nothing stores it.
 */
const NUL_MESSAGE = 'must not contain the NUL character (U+0000)';

/** The document's numeric path parameters (components/parameters/Id); slugs and versions are text. */
const NUMERIC_PATH_PARAMETERS = new Set(['id']);

/** Query values are strings, or arrays and objects of them under the extended parser. */
function walkQuery(value: unknown, path: string, out: FieldError[]): void {
  if (typeof value === 'string') {
    if (value.includes('\u0000')) out.push({ path, message: NUL_MESSAGE });
    else if (nonFiniteText(value))
      out.push({ path, message: `'${value.trim()}' is not a finite number` });
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => walkQuery(v, `${path}/${i}`, out));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) walkQuery(v, `${path}/${escapeKey(k)}`, out);
  }
}

/**
 * Whether a parsed body holds anything walkBody would name: nearly every body is clean, and this
 * check builds no paths (the walk below makes a string per key, a third of this step's cost).
 */
function bodyNeedsWalk(value: unknown, depth = 0): boolean {
  if (depth > 64) return false;
  if (typeof value === 'number') return !Number.isFinite(value);
  if (typeof value === 'string') return value.includes('\u0000');
  if (value === null || typeof value !== 'object') return false;
  if (Array.isArray(value)) return value.some((v) => bodyNeedsWalk(v, depth + 1));
  for (const key in value)
    if (bodyNeedsWalk((value as Record<string, unknown>)[key], depth + 1)) return true;
  return false;
}

/** JSON bodies: JSON.parse reads 1e999 as Infinity; no other way to a non-finite number exists. */
function walkBody(value: unknown, path: string, out: FieldError[], depth = 0): void {
  if (out.length >= 20 || depth > 64) return;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) out.push({ path, message: 'must be a finite number' });
  } else if (typeof value === 'string') {
    if (value.includes('\u0000')) out.push({ path, message: NUL_MESSAGE });
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => walkBody(v, `${path}/${i}`, out, depth + 1));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value))
      walkBody(v, `${path}/${escapeKey(k)}`, out, depth + 1);
  }
}

/**
 * Refuses non-finite numbers at the edge, before the validator and any handler see them: a
 * query value such as `Infinity`, `NaN` or `1e999` (the validator coerces those to numbers that
 * pass `type: integer` or slip past a maximum), and a JSON number that overflowed to Infinity.
 * Answers 400 problem+json naming each field (/query/days, /body/conductivity/value). Text with
 * a NUL character is refused the same way (see NUL_MESSAGE).
 */
export const refuseNonFinite: RequestHandler = (req, _res, next) => {
  const errors: FieldError[] = [];
  // Path parameters too (/keys/Infinity): the validator coerces such a word to a number that
  // passes `type: integer`, and it would reach a query (SQLite finds no row; PostgreSQL fails).
  if (req.operation?.template.includes('{')) {
    const template = req.operation.template.split('/');
    const actual = req.originalUrl
      .split('?')[0]!
      .replace(/^\/api\/v1/, '')
      .split('/');
    template.forEach((segment, i) => {
      const name = /^\{(.+)\}$/.exec(segment)?.[1];
      if (!name || actual[i] === undefined) return;
      let value: string;
      try {
        value = decodeURIComponent(actual[i]!);
      } catch {
        return;
      }
      if (value.includes('\u0000')) errors.push({ path: `/params/${name}`, message: NUL_MESSAGE });
      else if (NUMERIC_PATH_PARAMETERS.has(name) && nonFiniteText(value))
        errors.push({
          path: `/params/${name}`,
          message: `'${value.trim()}' is not a finite number`,
        });
    });
  }
  const query = req.query as unknown;
  if (query && typeof query === 'object') {
    for (const [k, v] of Object.entries(query)) walkQuery(v, `/query/${escapeKey(k)}`, errors);
  }
  if (req.body !== undefined && bodyNeedsWalk(req.body) && req.is('application/json'))
    walkBody(req.body, '/body', errors);
  if (errors.length === 0) return next();
  next(
    new ProblemError(
      400,
      'Bad request',
      errors.map((e) => `${e.path}: ${e.message}`).join('; '),
      errors,
    ),
  );
};
