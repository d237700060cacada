import fc from 'fast-check';

/**
 * openapi.yaml's schemas turned into fast-check arbitraries: schema-valid values (with the
 * extremes a schema still allows: 5e-324 where it says exclusiveMinimum 0, 1e9 where it says
 * maximum), hostile values (Infinity as text, 1e999 as a raw JSON number, wrong types, unicode),
 * and mutations of valid values (a field replaced, a required field dropped, an extra one added).
 * Also the same schemas as JSON Schema draft-07, for checking responses with Ajv.
 */

export type Schema = { [key: string]: unknown };
export interface OpenApiDocument {
  paths: Record<string, Record<string, unknown>>;
  components?: Record<string, Record<string, unknown>>;
}

/** Follows `$ref: '#/components/...'` until a schema (or parameter, response) with no $ref. */
export function deref<T = Schema>(doc: OpenApiDocument, node: unknown): T {
  let current = node as Schema;
  for (let hops = 0; current && typeof current.$ref === 'string'; hops++) {
    if (hops > 32) throw new Error(`$ref loop at ${String(current.$ref)}`);
    const parts = (current.$ref as string).replace(/^#\//, '').split('/');
    let target: unknown = doc;
    for (const p of parts) target = (target as Schema)[p];
    if (target === undefined) throw new Error(`unresolved $ref ${String(current.$ref)}`);
    current = target as Schema;
  }
  return current as T;
}

/** A JSON token written as is: 1e999, which JSON.parse reads as Infinity, cannot come from JSON.stringify. */
export class RawJson {
  constructor(readonly text: string) {}
  [fc.toStringMethod](): string {
    return `raw(${this.text})`;
  }
}

/** JSON text of a value that may hold RawJson tokens and own `__proto__` keys. */
export function toJsonText(value: unknown): string {
  if (value instanceof RawJson) return value.text;
  if (Array.isArray(value)) return `[${value.map(toJsonText).join(',')}]`;
  if (value !== null && typeof value === 'object')
    return `{${Object.entries(value)
      .map(([k, v]) => `${JSON.stringify(k)}:${toJsonText(v)}`)
      .join(',')}}`;
  return JSON.stringify(value) ?? 'null';
}

function clone(value: unknown): unknown {
  if (value instanceof RawJson || value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map(clone);
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value)) setOwn(out, k, clone(v));
  return out;
}

/** Sets an own, enumerable property, even one called __proto__. */
function setOwn(target: Record<string, unknown>, key: string, value: unknown): void {
  Object.defineProperty(target, key, {
    value,
    enumerable: true,
    writable: true,
    configurable: true,
  });
}

export interface GenOptions {
  /** Longest array generated for a valid value (schemas allow up to 500 frequencies). */
  maxItems: number;
  /** Replaces a schema at a pointer ('/filaments/coilRadial', '*' for any array index). */
  overrides?: Record<string, Schema>;
  /** Known-good values for a property or parameter by name (real slugs, demo e-mails). */
  hints?: Record<string, readonly unknown[]>;
  /** How often a hint is chosen over a generated value, as odds (default 1: half the time). */
  hintOdds?: Record<string, number>;
  /** Numbers a person would type only: no 5e-324, no 1e308 (still within the schema either way). */
  plain?: boolean;
}

const finiteDouble = (min: number, max: number, minExcluded = false, maxExcluded = false) =>
  fc.double({ min, max, minExcluded, maxExcluded, noNaN: true, noDefaultInfinity: true });

/** Numbers within the schema's bounds: whole numbers a person would type, log-spread ones, and the extremes. */
function numberArb(schema: Schema, integer: boolean, plain = false): fc.Arbitrary<number> {
  const exMin = schema.exclusiveMinimum === true;
  const exMax = schema.exclusiveMaximum === true;
  const min = typeof schema.minimum === 'number' ? schema.minimum : undefined;
  const max = typeof schema.maximum === 'number' ? schema.maximum : undefined;
  if (integer) {
    const lo = min === undefined ? -(2 ** 31) : exMin ? Math.floor(min) + 1 : Math.ceil(min);
    const hi = max === undefined ? 2 ** 31 : exMax ? Math.ceil(max) - 1 : Math.floor(max);
    const small = fc.integer({ min: lo, max: Math.min(hi, Math.max(lo, 10)) });
    if (plain) return small;
    return fc.oneof(
      { weight: 3, arbitrary: small },
      { weight: 1, arbitrary: fc.integer({ min: lo, max: hi }) },
      { weight: 1, arbitrary: fc.constantFrom(lo, hi) },
    );
  }
  const lo = min ?? -Number.MAX_VALUE;
  const hi = max ?? Number.MAX_VALUE;
  const friendlyLo = exMin ? Math.floor(lo) + 1 : Math.ceil(lo);
  const friendlyHi = Math.floor(Math.min(hi, 1000));
  const options: Array<fc.WeightedArbitrary<number>> = plain
    ? []
    : // Uniform over representable doubles: mostly very large or very small magnitudes.
      [{ weight: 2, arbitrary: finiteDouble(lo, hi, exMin, exMax) }];
  if (friendlyLo <= friendlyHi && friendlyHi - friendlyLo >= 0)
    options.push({
      weight: 4,
      arbitrary: fc.integer({ min: Math.max(friendlyLo, -1000), max: friendlyHi }),
    });
  if (hi > 0) {
    const bottom = Math.max(lo > 0 ? lo : 0, plain ? 1e-2 : 1e-6);
    if (bottom < hi)
      options.push({
        weight: 3,
        arbitrary: fc
          .double({ min: Math.log10(bottom), max: Math.log10(hi), noNaN: true })
          .map((e) => Math.min(hi, Math.max(bottom, Number((10 ** e).toPrecision(4))))),
      });
  }
  const edges = [lo, hi].filter((v, i) => Number.isFinite(v) && !(i === 0 ? exMin : exMax));
  if (edges.length && !plain) options.push({ weight: 1, arbitrary: fc.constantFrom(...edges) });
  return options.length ? fc.oneof(...options) : finiteDouble(lo, hi, exMin, exMax);
}

function stringArb(schema: Schema): fc.Arbitrary<string> {
  const minLength = typeof schema.minLength === 'number' ? schema.minLength : 0;
  const maxLength = typeof schema.maxLength === 'number' ? schema.maxLength : 40;
  const fits = (s: string) => s.length >= minLength && s.length <= maxLength;
  if (typeof schema.pattern === 'string')
    return fc.stringMatching(new RegExp(schema.pattern)).filter(fits);
  if (schema.format === 'email') return fc.emailAddress().filter(fits);
  if (schema.format === 'date-time')
    return fc
      .date({ min: new Date('2000-01-01'), max: new Date('2100-01-01'), noInvalidDate: true })
      .map((d) => d.toISOString());
  const cap = Math.min(maxLength, Math.max(minLength, 40));
  return fc.oneof(
    fc.string({ minLength, maxLength: cap }),
    fc.string({ minLength, maxLength: cap, unit: 'grapheme' }),
  );
}

function mergeAllOf(doc: OpenApiDocument, schema: Schema): Schema {
  if (!Array.isArray(schema.allOf)) return schema;
  const merged: Schema = { ...schema, allOf: undefined };
  const properties: Schema = {};
  const required: string[] = [];
  for (const part of [...(schema.allOf as unknown[]).map((s) => deref(doc, s)), schema]) {
    Object.assign(properties, part.properties ?? {});
    required.push(...((part.required as string[]) ?? []));
    if (part.type) merged.type = part.type;
  }
  return { ...merged, properties, required };
}

/** A schema-valid value (in the sense of openapi.yaml) at `pointer` of a request part. */
export function validArb(
  doc: OpenApiDocument,
  raw: unknown,
  options: GenOptions,
  pointer = '',
  name?: string,
): fc.Arbitrary<unknown> {
  const override = options.overrides?.[pointer.replace(/\/\d+(?=\/|$)/g, '/*')];
  let schema = mergeAllOf(doc, deref(doc, raw));
  if (override) schema = { ...schema, ...override };
  const arb = baseArb(doc, schema, options, pointer);
  const hint = name ? options.hints?.[name] : undefined;
  const withHint = hint?.length
    ? fc.oneof(
        { weight: options.hintOdds?.[name!] ?? 1, arbitrary: fc.constantFrom(...hint) },
        { weight: 1, arbitrary: arb },
      )
    : arb;
  return schema.nullable === true
    ? fc.oneof({ weight: 5, arbitrary: withHint }, { weight: 1, arbitrary: fc.constant(null) })
    : withHint;
}

function baseArb(
  doc: OpenApiDocument,
  schema: Schema,
  options: GenOptions,
  pointer: string,
): fc.Arbitrary<unknown> {
  if (Array.isArray(schema.enum)) return fc.constantFrom(...(schema.enum as unknown[]));
  const alternatives = (schema.oneOf ?? schema.anyOf) as unknown[] | undefined;
  if (Array.isArray(alternatives))
    return fc.oneof(...alternatives.map((s) => validArb(doc, s, options, pointer)));
  switch (schema.type) {
    case 'string':
      return stringArb(schema);
    case 'number':
      return numberArb(schema, false, options.plain);
    case 'integer':
      return numberArb(schema, true, options.plain);
    case 'boolean':
      return fc.boolean();
    case 'array': {
      const minLength = typeof schema.minItems === 'number' ? schema.minItems : 0;
      const maxItems = typeof schema.maxItems === 'number' ? schema.maxItems : Infinity;
      const maxLength = Math.max(minLength, Math.min(maxItems, options.maxItems));
      return fc.array(validArb(doc, schema.items ?? {}, options, `${pointer}/0`), {
        minLength,
        maxLength,
      });
    }
    case 'object':
    case undefined: {
      const properties = (schema.properties ?? {}) as Record<string, unknown>;
      const keys = Object.keys(properties);
      if (!keys.length && schema.type === undefined) return fc.jsonValue({ maxDepth: 2 });
      if (!keys.length)
        return fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 1 }), {
          maxKeys: 3,
        });
      const model: Record<string, fc.Arbitrary<unknown>> = {};
      for (const k of keys) model[k] = validArb(doc, properties[k], options, `${pointer}/${k}`, k);
      const required = ((schema.required as string[]) ?? []).filter((k) => keys.includes(k));
      const minProperties = typeof schema.minProperties === 'number' ? schema.minProperties : 0;
      return fc
        .record(model, { requiredKeys: required })
        .filter((o) => Object.keys(o).length >= minProperties);
    }
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

/** Values no schema here accepts, or only barely: the edge of every parser. */
export const HOSTILE_SCALARS: readonly unknown[] = [
  'Infinity',
  '-Infinity',
  'NaN',
  '1e999',
  '',
  ' ',
  '0',
  '-1',
  'true',
  'null',
  '\u0000',
  '\u202e‮',
  'ünïcødé',
  '日本語',
  '🦄🧪',
  'e\u0301',
  '%00',
  '../..',
  'x'.repeat(3000),
  null,
  true,
  false,
  0,
  -0,
  -1,
  1.5,
  1e308,
  -1e308,
  5e-324,
  -5e-324,
  2 ** 53 + 2,
  1e21,
  [],
  [1, 'a'],
  {},
  { value: 1, unit: 'm' },
  new RawJson('1e999'),
  new RawJson('-1e999'),
  new RawJson('1e-999'),
  new RawJson('-0'),
  new RawJson('1E400'),
];

export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(...HOSTILE_SCALARS) },
  { weight: 1, arbitrary: fc.string({ maxLength: 12, unit: 'grapheme' }) },
  { weight: 1, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.integer() },
);

/** Query and path text that parsers trip on; already URL-safe (Node refuses raw spaces and non-ASCII). */
export const HOSTILE_TEXT: readonly string[] = [
  'Infinity',
  '-Infinity',
  '+Infinity',
  'NaN',
  'nan',
  '1e999',
  '-1e999',
  '1e-999',
  '',
  '%20',
  '0',
  '-0',
  '-1',
  '1.5',
  '0x10',
  '1_000',
  '9007199254740993',
  '1e21',
  '%D9%A1%D9%A2',
  '%',
  '%zz',
  '%00',
  '%E2%80%AE',
  '%F0%9F%A6%84',
  'true',
  '%5B%5D',
  '..',
  '.',
  '%2e%2e',
  '%2F',
  'a'.repeat(2000),
];

export type Mutation =
  | { kind: 'replace'; at: number; value: unknown }
  | { kind: 'delete'; at: number; key: number }
  | { kind: 'extra'; at: number; name: string; value: unknown };

export const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  {
    weight: 4,
    arbitrary: fc.record({
      kind: fc.constant('replace' as const),
      at: fc.nat(),
      value: hostileValue,
    }),
  },
  {
    weight: 2,
    arbitrary: fc.record({ kind: fc.constant('delete' as const), at: fc.nat(), key: fc.nat() }),
  },
  {
    weight: 1,
    arbitrary: fc.record({
      kind: fc.constant('extra' as const),
      at: fc.nat(),
      name: fc.constantFrom('extra', '__proto__', 'constructor', '', 'é', 'value', 'unit'),
      value: hostileValue,
    }),
  },
);

type Slot = { node: unknown; set: (v: unknown) => void };

function slots(root: { value: unknown }): Slot[] {
  const out: Slot[] = [];
  const visit = (node: unknown, set: (v: unknown) => void) => {
    out.push({ node, set });
    if (node instanceof RawJson || node === null || typeof node !== 'object') return;
    for (const [k, v] of Object.entries(node)) {
      visit(v, (x) => setOwn(node as Record<string, unknown>, k, x));
    }
  };
  visit(root.value, (x) => (root.value = x));
  return out;
}

/** Applies mutations to a copy of a value; indices wrap around, so any nat picks some node. */
export function applyMutations(value: unknown, mutations: readonly Mutation[]): unknown {
  const root = { value: clone(value) };
  for (const m of mutations) {
    const all = slots(root);
    if (m.kind === 'replace') {
      // A copy: the hostile constants ({}, []) are shared, and must neither change nor nest in themselves.
      all[m.at % all.length]!.set(clone(m.value));
      continue;
    }
    const objects = all
      .map((s) => s.node)
      .filter(
        (n): n is Record<string, unknown> =>
          n !== null && typeof n === 'object' && !Array.isArray(n) && !(n instanceof RawJson),
      );
    if (!objects.length) continue;
    const target = objects[m.at % objects.length]!;
    if (m.kind === 'delete') {
      const keys = Object.keys(target);
      if (keys.length) delete target[keys[m.key % keys.length]!];
    } else {
      setOwn(target, m.name, clone(m.value));
    }
  }
  return root.value;
}

/** A valid value with one to three mutations. */
export function mutatedArb(valid: fc.Arbitrary<unknown>): fc.Arbitrary<unknown> {
  return fc
    .tuple(valid, fc.array(mutationArb, { minLength: 1, maxLength: 3 }))
    .map(([v, ms]) => applyMutations(v, ms));
}

/**
 * The schema as JSON Schema draft-07 for Ajv: $refs inlined, OpenAPI 3.0's `nullable` turned
 * into a null type and its boolean exclusiveMinimum/Maximum into numbers.
 */
export function toJsonSchema(doc: OpenApiDocument, raw: unknown, depth = 0): unknown {
  if (depth > 64) throw new Error('schema too deep (a $ref cycle?)');
  if (Array.isArray(raw)) return raw.map((s) => toJsonSchema(doc, s, depth + 1));
  if (raw === null || typeof raw !== 'object') return raw;
  const schema = deref(doc, raw);
  const out: Schema = {};
  for (const [k, v] of Object.entries(schema)) {
    if (k.startsWith('x-') || k === 'nullable' || k === 'example' || k === 'format') continue;
    if (k === 'exclusiveMinimum' || k === 'exclusiveMaximum') continue;
    if (k === 'properties') {
      out.properties = Object.fromEntries(
        Object.entries(v as Schema).map(([p, s]) => [p, toJsonSchema(doc, s, depth + 1)]),
      );
    } else if (['items', 'additionalProperties', 'not'].includes(k) && typeof v === 'object') {
      out[k] = toJsonSchema(doc, v, depth + 1);
    } else if (['allOf', 'oneOf', 'anyOf'].includes(k)) {
      out[k] = toJsonSchema(doc, v, depth + 1);
    } else {
      out[k] = v;
    }
  }
  if (schema.exclusiveMinimum === true && typeof schema.minimum === 'number') {
    out.exclusiveMinimum = schema.minimum;
    delete out.minimum;
  }
  if (schema.exclusiveMaximum === true && typeof schema.maximum === 'number') {
    out.exclusiveMaximum = schema.maximum;
    delete out.maximum;
  }
  if (schema.nullable === true) {
    if (typeof out.type === 'string') out.type = [out.type, 'null'];
    else return { anyOf: [out, { type: 'null' }] };
    if (Array.isArray(out.enum)) out.enum = [...(out.enum as unknown[]), null];
  }
  return out;
}
