import type { ErrorOption } from 'react-hook-form';
import { describe, expect, it } from 'vitest';
import { ApiProblem, fieldOfPath } from '../../frontend/lib/api-client';
import {
  fieldProblems,
  labelOfField,
  plainMessage,
  plainPhrase,
  setFieldErrors,
} from '../../frontend/lib/field-errors';

// The validator's messages are ajv's (v8) English defaults, as express-openapi-validator passes
// them on; the paths are the ones backend/http/problem.ts writes.
const problem = (errors: Array<{ path: string; message: string }>) =>
  new ApiProblem({
    type: 'urn:conductory:problem:invalid-input',
    title: 'Bad request',
    status: 400,
    detail: errors.map((e) => `${e.path}: ${e.message}`).join('; '),
    errors,
  });

describe('field paths', () => {
  it.each([
    ['/body/source/citation', 'source.citation'],
    ['/query/q', 'q'],
    ['/body', ''],
    ['/body/layers/0/thickness', 'layers.0.thickness'],
    ['citation', 'citation'],
  ])('%s → %s', (path, field) => expect(fieldOfPath(path)).toBe(field));

  it('names a field a person can read when the form gives no label', () => {
    expect(labelOfField('source.citation')).toBe('Source citation');
    expect(labelOfField('expiresAt')).toBe('Expires at');
    expect(labelOfField('layers.0.thickness')).toBe('Layers thickness');
    expect(labelOfField('')).toBe('The request');
  });
});

describe('plain words for the validator’s', () => {
  it.each([
    ['must NOT have fewer than 5 characters', 'use at least 5 characters'],
    ['must NOT have fewer than 1 characters', 'fill this in'],
    ['must NOT have more than 80 characters', 'use at most 80 characters'],
    ['must be >= 1', 'enter 1 or more'],
    ['must be > 0', 'enter more than 0'],
    ['must be <= 730', 'enter 730 or less'],
    ["must have required property 'citation'", 'this is required'],
    ['must match format "email"', 'enter an e-mail address, such as name@example.com'],
    ['must be equal to one of the allowed values', 'choose one of the offered values'],
    ['must be number', 'enter a number'],
    ['must match pattern "\\S"', 'fill this in (spaces alone do not count)'],
    ['must lie in the future', 'must lie in the future'],
  ])('%s', (raw, plain) => {
    expect(plainPhrase(raw)).toBe(plain);
    expect(plainPhrase(raw)).not.toMatch(/must NOT|>=|<=|required property/);
  });

  it('puts the label first in a list', () => {
    expect(plainMessage('must NOT have fewer than 5 characters', 'Source: citation')).toBe(
      'Source: citation: use at least 5 characters.',
    );
  });
});

describe('setFieldErrors', () => {
  it('sets one plain message per field, on the form’s own field, focusing the first', () => {
    const calls: Array<[string, ErrorOption, unknown]> = [];
    const error = problem([
      { path: '/body/source/citation', message: 'must NOT have fewer than 5 characters' },
      { path: '/body/source/citation', message: 'must NOT have fewer than 5 characters' },
      { path: '/body/source/citation', message: 'must match pattern "\\S"' },
      { path: '/body/reason', message: "must have required property 'reason'" },
      { path: '/body/alloy', message: 'must be string' },
    ]);
    expect(fieldProblems(error)).toHaveLength(4); // the repeated one once
    setFieldErrors<{ citation: string; reason: string }>(
      error,
      (name, err, options) => calls.push([name, err, options]),
      {
        'source.citation': { name: 'citation', label: 'Source: citation' },
        reason: { name: 'reason', label: 'Reason' },
      },
    );
    expect(calls).toEqual([
      ['citation', { type: 'server', message: 'use at least 5 characters' }, { shouldFocus: true }],
      ['reason', { type: 'server', message: 'this is required' }, { shouldFocus: false }],
    ]);
  });

  it('leaves anything but a problem alone', () => {
    const calls: unknown[] = [];
    setFieldErrors(new Error('offline'), () => calls.push(1), {});
    expect(calls).toEqual([]);
  });
});
