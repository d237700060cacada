import fc from 'fast-check';
import type { Response, Test } from 'supertest';
import {
  deref,
  HOSTILE_TEXT,
  hostileValue,
  mutatedArb,
  RawJson,
  toJsonText,
  validArb,
  type GenOptions,
  type OpenApiDocument,
  type Schema,
} from './schema-arbitraries';

export interface Operation {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** As written in openapi.yaml, e.g. /keys/{id}/rotate. */
  template: string;
  definition: Schema;
}

interface Parameter {
  name: string;
  in: 'path' | 'query' | 'header' | 'cookie';
  required?: boolean;
  schema: Schema;
}

export type FuzzBody =
  | { kind: 'none' }
  | { kind: 'json'; value: unknown }
  | { kind: 'text'; contentType: string; text: string }
  | { kind: 'multipart'; file?: { name: string; text: string }; fields: Array<[string, string]> };

export interface FuzzRequest {
  method: Operation['method'];
  /** Path and query, already percent-encoded where the request means it to be. */
  url: string;
  body: FuzzBody;
}

const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;

/** Every operation of openapi.yaml, in document order. */
export function operationsOf(doc: OpenApiDocument): Operation[] {
  const out: Operation[] = [];
  for (const [template, item] of Object.entries(doc.paths))
    for (const method of METHODS)
      if (item[method]) out.push({ method, template, definition: item[method] as Schema });
  return out;
}

function parametersOf(doc: OpenApiDocument, op: Operation): Parameter[] {
  const pathItem = doc.paths[op.template]!;
  const all = [
    ...((pathItem.parameters as unknown[]) ?? []),
    ...((op.definition.parameters as unknown[]) ?? []),
  ];
  return all.map((p) => deref<Parameter>(doc, p));
}

/** The JSON request body's schema, or undefined when the operation takes none (or not JSON). */
export function jsonBodySchema(doc: OpenApiDocument, op: Operation): Schema | undefined {
  const body = op.definition.requestBody
    ? deref<Schema>(doc, op.definition.requestBody)
    : undefined;
  const content = body?.content as Record<string, { schema?: unknown }> | undefined;
  const schema = content?.['application/json']?.schema;
  return schema ? deref(doc, schema) : undefined;
}

const enc = (v: unknown) => encodeURIComponent(String(v));

/** A path segment: a valid value mostly, an odd one (dot segments, escapes, 2000 characters) sometimes. */
function pathSegmentArb(
  doc: OpenApiDocument,
  p: Parameter,
  options: GenOptions,
): fc.Arbitrary<string> {
  return fc.oneof(
    { weight: 5, arbitrary: validArb(doc, p.schema, options, '', p.name).map(enc) },
    { weight: 2, arbitrary: fc.constantFrom(...HOSTILE_TEXT) },
    { weight: 1, arbitrary: fc.string({ minLength: 1, maxLength: 12, unit: 'grapheme' }).map(enc) },
  );
}

/** The query string: each parameter given or not, valid mostly, hostile text or shapes sometimes. */
function queryArb(
  doc: OpenApiDocument,
  params: Parameter[],
  options: GenOptions,
): fc.Arbitrary<string> {
  const entries = params.map((p) => {
    const valid = validArb(doc, p.schema, options, '', p.name).map((v) =>
      Array.isArray(v) ? v.map((x) => `${p.name}=${enc(x)}`) : [`${p.name}=${enc(v)}`],
    );
    const hostile = fc.oneof(
      fc.constantFrom(...HOSTILE_TEXT).map((t) => [`${p.name}=${t}`]),
      fc.constantFrom(
        [`${p.name}[]=1`],
        [`${p.name}[a]=1`],
        [`${p.name}[a][b][c]=x`],
        [`${p.name}=1`, `${p.name}=2`],
        [p.name],
        [`${p.name}=`],
      ),
    );
    const given = fc.oneof({ weight: 4, arbitrary: valid }, { weight: 1, arbitrary: hostile });
    return p.required ? given : fc.option(given, { nil: [] as string[], freq: 2 });
  });
  // An undeclared parameter now and then (fc.option's freq is the odds of the nil value).
  const extra = fc.oneof(
    { weight: 9, arbitrary: fc.constant<string[]>([]) },
    {
      weight: 1,
      arbitrary: fc.constantFrom(
        ['unknown=1'],
        ['__proto__[x]=1'],
        ['constructor=1'],
        ['%F0%9F%A6%84=1'],
      ),
    },
  );
  return fc.tuple(fc.tuple(...entries), extra).map(([parts, more]) => {
    const all = [...parts.flat(), ...more];
    return all.length ? `?${all.join('&')}` : '';
  });
}

const RAW_BODIES: readonly FuzzBody[] = [
  { kind: 'text', contentType: 'application/json', text: '{' },
  { kind: 'text', contentType: 'application/json', text: '' },
  { kind: 'text', contentType: 'application/json', text: 'null' },
  { kind: 'text', contentType: 'application/json', text: '1e999' },
  { kind: 'text', contentType: 'application/json', text: '"x"' },
  { kind: 'text', contentType: 'application/json', text: '[{"value":1e999}]' },
  { kind: 'text', contentType: 'application/json', text: '{"__proto__":{"admin":true}}' },
  { kind: 'text', contentType: 'application/json; charset=utf-16', text: '{}' },
  { kind: 'text', contentType: 'text/plain', text: 'hello' },
  { kind: 'text', contentType: 'application/x-www-form-urlencoded', text: 'a=1&b[c]=2' },
  { kind: 'text', contentType: 'application/xml', text: '<a>1</a>' },
  { kind: 'text', contentType: 'multipart/form-data; boundary=x', text: '--x\r\nbroken' },
  { kind: 'text', contentType: 'application/octet-stream', text: '\u0000\u0001\u00ff' },
];

/** A JSON body: valid mostly, mutated often, something else now and then. */
function jsonBodyArb(
  doc: OpenApiDocument,
  schema: Schema,
  options: GenOptions,
  shaping: BodyShaping,
): fc.Arbitrary<FuzzBody> {
  // Half the valid bodies with plain numbers throughout: with some fifteen numbers in a launch,
  // one extreme among them is otherwise near certain, and the answer a 422.
  const refine = shaping.refine ?? ((b: unknown) => b);
  const valid = fc
    .oneof(
      validArb(doc, schema, options),
      validArb(doc, schema, { ...options, plain: true }),
      ...(shaping.plausible ? [shaping.plausible] : []),
    )
    .map((b) => refine(structuredClone(b)));
  return fc.oneof(
    { weight: 12, arbitrary: valid.map((value): FuzzBody => ({ kind: 'json', value })) },
    { weight: 6, arbitrary: mutatedArb(valid).map((value): FuzzBody => ({ kind: 'json', value })) },
    { weight: 1, arbitrary: hostileValue.map((value): FuzzBody => ({ kind: 'json', value })) },
    { weight: 1, arbitrary: fc.constantFrom(...RAW_BODIES) },
    { weight: 1, arbitrary: fc.constant<FuzzBody>({ kind: 'none' }) },
  );
}

/**
 * POST /imports is multipart and skipped by the validator: random CSV text as the file (or in
 * place of it), random fields, and bodies that are not multipart at all.
 */
function importBodyArb(hints: GenOptions['hints']): fc.Arbitrary<FuzzBody> {
  const header =
    'slug,name,family,uns,conductivity_iacs,conductivity_min_iacs,conductivity_max_iacs,density_g_cm3,notes';
  const cell = fc.oneof(
    fc.constantFrom(
      '',
      'copper',
      'x',
      '28',
      '1e999',
      'Infinity',
      'NaN',
      '-1',
      '=cmd|x',
      '"q""',
      '8.9',
    ),
    fc.string({ maxLength: 8, unit: 'grapheme' }),
  );
  const row = fc.array(cell, { minLength: 0, maxLength: 10 }).map((cells) => cells.join(','));
  const slugs = (hints?.slug ?? ['copper-c11000']) as string[];
  const csv = fc.oneof(
    fc
      .tuple(fc.constantFrom(header, 'slug,name', ''), fc.array(row, { maxLength: 4 }))
      .map(([h, rows]) => [h, ...rows].join('\r\n')),
    fc.constantFrom(...slugs).map((s) => `${header}\r\n${s},Name,copper,,50,,,8.9,`),
    fc.string({ maxLength: 200, unit: 'binary' }),
    fc.constantFrom('\uFEFF' + header + '\n', '{"items":[]}', '[]', '\u0000\u0000'),
  );
  const field = fc.tuple(
    fc.constantFrom('apply', 'citation', 'sourceKind', 'locator', 'reason', 'file', 'extra'),
    fc.oneof(
      fc.constantFrom('true', 'false', 'handbook', 'a citation text', '', 'Infinity'),
      fc.string({ maxLength: 20, unit: 'grapheme' }),
    ),
  );
  const multipart = fc.record({
    file: fc.option(
      fc.record({
        name: fc.constantFrom('a.csv', 'a.json', 'a.txt', 'noext', '..\\..\\x.csv'),
        text: csv,
      }),
      { nil: undefined, freq: 6 },
    ),
    fields: fc.array(field, { maxLength: 4 }),
  });
  return fc.oneof(
    { weight: 6, arbitrary: multipart.map((m): FuzzBody => ({ kind: 'multipart', ...m })) },
    {
      weight: 2,
      arbitrary: fc
        .tuple(
          fc.constantFrom(
            'text/csv',
            'application/json',
            'multipart/form-data',
            'multipart/form-data; boundary=zzz',
            'text/plain',
            'application/octet-stream',
          ),
          csv,
        )
        .map(([contentType, text]): FuzzBody => ({ kind: 'text', contentType, text })),
    },
    { weight: 1, arbitrary: fc.constantFrom(...RAW_BODIES) },
    { weight: 1, arbitrary: fc.constant<FuzzBody>({ kind: 'none' }) },
  );
}

/**
 * POST /match/batch takes a CSV as a text/csv body or a multipart upload, and is skipped by the
 * validator: headers of every kind (units in brackets, unit columns, unknown and missing
 * columns), rows of random cells, binary text, and bodies of other types.
 */
function batchBodyArb(): fc.Arbitrary<FuzzBody> {
  const header = fc.constantFrom(
    'id,conductivity (%IACS),temperature (C),density (g/cm3),frequency (kHz)',
    'id,resistivity,resistivity_unit,temperature,temperature_unit,uncertainty_percent',
    'conductivity (MS/m),temperature (K)',
    'conductivity,temperature (C)',
    'id,conductivity (mS/m),temperature (C)',
    'id,colour',
    'R-1,28,20',
    '',
  );
  const cell = fc.oneof(
    fc.constantFrom('', '28', '25.6', '27', '8.49', '60', 'uohm_cm', '%IACS', 'F', 'K', '6,16'),
    fc.constantFrom('-1', '0', '1e999', 'NaN', 'Infinity', '1e-320', '=cmd|x', '"q""', '400'),
    fc.string({ maxLength: 8, unit: 'grapheme' }),
  );
  const row = fc.array(cell, { minLength: 0, maxLength: 7 }).map((cells) => cells.join(','));
  const csv = fc.oneof(
    fc.tuple(header, fc.array(row, { maxLength: 5 })).map(([h, rows]) => [h, ...rows].join('\r\n')),
    fc.string({ maxLength: 200, unit: 'binary' }),
    fc.constantFrom('\uFEFFconductivity (%IACS),temperature (C)\n28,20\n', '\u0000\u0000', '"'),
  );
  return fc.oneof(
    {
      weight: 5,
      arbitrary: fc
        .tuple(
          fc.constantFrom('text/csv', 'text/csv; charset=utf-8', 'text/csv; charset=latin1'),
          csv,
        )
        .map(([contentType, text]): FuzzBody => ({ kind: 'text', contentType, text })),
    },
    {
      weight: 3,
      arbitrary: fc
        .record({
          file: fc.option(
            fc.record({ name: fc.constantFrom('a.csv', 'noext', '..\\x.csv'), text: csv }),
            { nil: undefined, freq: 6 },
          ),
          fields: fc.array(
            fc.tuple(fc.constantFrom('file', 'plan', 'extra'), fc.string({ maxLength: 8 })),
            {
              maxLength: 2,
            },
          ),
        })
        .map((m): FuzzBody => ({ kind: 'multipart', ...m })),
    },
    { weight: 1, arbitrary: fc.constantFrom(...RAW_BODIES) },
    { weight: 1, arbitrary: fc.constant<FuzzBody>({ kind: 'none' }) },
  );
}

export interface BodyShaping {
  /** Turns a schema-valid body into one the operation can use (outer radius beyond inner...); gets a copy. */
  refine?: (body: unknown) => unknown;
  /** Bodies like a practitioner's, mixed in with the generated valid ones. */
  plausible?: fc.Arbitrary<unknown>;
}

/** Requests for one operation: its path with parameters filled in, a query, a body. */
export function requestArb(
  doc: OpenApiDocument,
  op: Operation,
  options: GenOptions,
  shaping: BodyShaping = {},
): fc.Arbitrary<FuzzRequest> {
  const params = parametersOf(doc, op);
  const pathParams = params.filter((p) => p.in === 'path');
  const pathArb = fc
    .tuple(...pathParams.map((p) => pathSegmentArb(doc, p, options)))
    .map((values) =>
      pathParams.reduce((path, p, i) => path.replace(`{${p.name}}`, values[i]!), op.template),
    );
  const query = queryArb(
    doc,
    params.filter((p) => p.in === 'query'),
    options,
  );
  const schema = jsonBodySchema(doc, op);
  const body: fc.Arbitrary<FuzzBody> =
    op.template === '/imports'
      ? importBodyArb(options.hints)
      : op.template === '/match/batch'
        ? batchBodyArb()
        : schema
          ? jsonBodyArb(doc, schema, options, shaping)
          : fc.oneof(
              { weight: 12, arbitrary: fc.constant<FuzzBody>({ kind: 'none' }) },
              {
                weight: 1,
                arbitrary: hostileValue.map((value): FuzzBody => ({ kind: 'json', value })),
              },
              { weight: 1, arbitrary: fc.constantFrom(...RAW_BODIES) },
            );
  return fc.record({ path: pathArb, query, body }).map(({ path, query: q, body: b }) => ({
    method: op.method,
    url: `/api/v1${path}${q}`,
    body: b,
  }));
}

/** Sends a request through supertest (a plain request or a signed-in agent). */
export function send(
  client: Record<FuzzRequest['method'], (url: string) => Test>,
  req: FuzzRequest,
): Test {
  const test = client[req.method](req.url);
  const b = req.body;
  if (b.kind === 'json')
    return test.set('Content-Type', 'application/json').send(toJsonText(b.value));
  if (b.kind === 'text') return test.set('Content-Type', b.contentType).send(b.text);
  if (b.kind === 'multipart') {
    for (const [name, value] of b.fields) test.field(name, value);
    if (b.file) test.attach('file', Buffer.from(b.file.text), b.file.name);
    return test;
  }
  return test;
}

/** The request as text, for a failure message. */
export function describeRequest(req: FuzzRequest): string {
  const b = req.body;
  const body =
    b.kind === 'json'
      ? toJsonText(b.value)
      : b.kind === 'text'
        ? `(${b.contentType}) ${JSON.stringify(b.text)}`
        : b.kind === 'multipart'
          ? `multipart ${JSON.stringify({ fields: b.fields, file: b.file })}`
          : '(no body)';
  return `${req.method.toUpperCase()} ${req.url}\n${body.slice(0, 2000)}`;
}

export function describeResponse(res: Response): string {
  const text = res.text ?? JSON.stringify(res.body);
  return `${res.status} ${String(res.headers['content-type'])}\n${String(text).slice(0, 2000)}`;
}

export { RawJson };
