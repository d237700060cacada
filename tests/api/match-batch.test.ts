import { execFile } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Readable } from 'node:stream';
import { promisify } from 'node:util';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BATCH_CSV_COLUMNS, type BatchLine } from '../../shared/match/batch-results';
import { MAX_BATCH_BYTES, MAX_BATCH_ROWS, readBatch } from '../../backend/services/match-batch';
import { bearer, demo, newKey, sessionCookieOf, signedIn } from '../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../helpers/test-app';

const run = promisify(execFile);
let t: TestApp;
let integrator: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  integrator = await signedIn(t.app, 'integrator');
});
afterAll(() => t.knex.destroy());

const URL = '/api/v1/match/batch';
const HEADER = 'id,conductivity (%IACS),temperature (C),density (g/cm3),frequency (kHz)';

/** Reads any answer body as text (superagent buffers only the text types it knows). */
const asText = (res: http.IncomingMessage, callback: (e: Error | null, body: string) => void) => {
  let text = '';
  res.setEncoding('utf8');
  res.on('data', (chunk: string) => (text += chunk));
  res.on('end', () => callback(null, text));
};

const postCsv = (csv: string | Buffer, accept = 'text/csv') =>
  integrator
    .post(URL)
    .set('Content-Type', 'text/csv')
    .set('Accept', accept)
    .buffer(true)
    .parse(asText as never)
    .send(typeof csv === 'string' ? Buffer.from(csv) : csv);

/** A CSV answer as records keyed by column (our own answer: no quoted commas in these tests). */
function csvRows(text: string): Array<Record<string, string>> {
  const [head, ...lines] = text.trimEnd().split('\r\n');
  const columns = head!.split(',');
  return lines.map((l) => Object.fromEntries(l.split(',').map((v, i) => [columns[i]!, v])));
}
const ndjson = (text: string) =>
  text
    .trimEnd()
    .split('\n')
    .map((l) => JSON.parse(l) as BatchLine);

function expectProblem(res: request.Response, status: number, detail: RegExp) {
  expect(res.status, String(res.body?.detail ?? res.text)).toBe(status);
  expect(res.type).toBe('application/problem+json');
  const body = typeof res.body === 'string' ? JSON.parse(res.body) : res.body;
  expect(body.detail).toMatch(detail);
}

describe('GET /api/v1/match/batch/template', () => {
  it('is a CSV anyone may fetch, naming the columns, with the demo recycler’s invented readings', async () => {
    const res = await request(t.app).get(`${URL}/template`);
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/csv');
    expect(res.headers['content-disposition']).toMatch(/attachment/);
    expect(res.text.split('\r\n')[0]).toBe(HEADER);
    expect(res.text).toMatch(/R-102 brass fitting \(invented\)/);
  });
});

describe('POST /api/v1/match/batch', () => {
  it('ranks the template’s readings as POST /match ranks each one (same top three, same scores)', async () => {
    const template = (await request(t.app).get(`${URL}/template`)).text;
    const res = await postCsv(template);
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/csv');
    expect(res.headers['x-batch-rows']).toBe('4');
    expect(res.headers['x-batch-errors']).toBe('0');
    expect((res.body as string).split('\r\n')[0]).toBe(BATCH_CSV_COLUMNS.join(','));
    const rows = csvRows(res.body as string);
    expect(rows.map((r) => r.row)).toEqual(['2', '3', '4', '5']);
    // The check value: the single-reading route, whose scores tests/api/match.test.ts checks.
    const readings = [
      [52.1, 2.7],
      [25.6, 8.49],
      [97.8, 8.9],
      [26.4, 6.61],
    ];
    for (const [i, [iacs, density]] of readings.entries()) {
      const single = await request(t.app)
        .post('/api/v1/match')
        .send({
          conductivity: { value: iacs, unit: '%IACS' },
          temperature: { value: 27, unit: 'C' },
          density: { value: density, unit: 'g/cm3' },
          limit: 3,
        });
      const expected = single.body.candidates as Array<{ slug: string; score: number }>;
      expect(expected.length).toBeGreaterThan(0);
      expect(rows[i]!.status).toBe('matched');
      expected.forEach((c, k) => {
        expect(rows[i]![`candidate_${k + 1}_slug`]).toBe(c.slug);
        expect(Number(rows[i]![`candidate_${k + 1}_score`])).toBe(c.score);
      });
    }
    // 27 °C is 300.15 K (the kelvin's definition); 60 kHz is 60 000 Hz.
    expect(Number(rows[0]!.temperature_k)).toBeCloseTo(300.15, 9);
    expect(Number(rows[0]!.frequency_hz)).toBe(60_000);
    // 52.1 %IACS × 0.58 MS/m per %IACS (IEC 60028: 100 %IACS = 58.0 MS/m).
    expect(Number(rows[0]!.conductivity_s_per_m)).toBeCloseTo(52.1 * 0.58e6, 3);
  });

  it('answers NDJSON when Accept asks for it, one JSON line per reading', async () => {
    const csv = `${HEADER}\r\nR-102,25.6,27,8.49,60\r\nR-105,2.37,27,7.98,60\r\n`;
    const res = await postCsv(csv, 'application/x-ndjson');
    expect(res.status).toBe(200);
    expect(res.type).toBe('application/x-ndjson');
    const lines = ndjson(res.body as string);
    expect(lines).toHaveLength(2);
    expect(lines[0]).toMatchObject({ row: 2, id: 'R-102', status: 'matched' });
    if (lines[0]!.status === 'error') throw new Error('unexpected');
    expect(lines[0]!.candidates.length).toBeLessThanOrEqual(3);
    expect(lines[0]!.reading.densityKgPerM3).toBeCloseTo(8490, 6);
  });

  it('takes the file as a multipart upload too, with the same answer', async () => {
    const csv = `${HEADER}\r\nR-104,26.4,27,6.61,60\r\n`;
    const direct = await postCsv(csv);
    const res = await integrator
      .post(URL)
      .set('Accept', 'text/csv')
      .attach('file', Buffer.from(csv), 'line-4.csv');
    expect(res.status).toBe(200);
    expect(res.text).toBe(direct.body as string);
  });

  it('an API key with the integrator role may call it', async () => {
    const { key } = await newKey(integrator, 'integrator', 'batch key');
    const res = await request(t.app)
      .post(URL)
      .set(bearer(key))
      .set('Content-Type', 'text/csv')
      .send(`${HEADER}\r\nR-101,52.1,27,2.70,60\r\n`);
    expect(res.status).toBe(200);
  });

  it('a bad row gets its own error line with its row number, and the rest go on', async () => {
    const csv = [
      HEADER,
      'good-1,25.6,27,8.49,60',
      'not-a-number,abc,27,8.49,60',
      '',
      'good-2,97.8,27,8.90,60',
      'short-row,26.4,27',
      'too-hot,26.4,400,6.61,60',
      'negative,-3,20,,',
      'good-3,52.1,27,,',
      '',
    ].join('\r\n');
    const res = await postCsv(csv, 'application/x-ndjson');
    expect(res.status).toBe(200);
    expect(res.headers['x-batch-rows']).toBe('7');
    expect(res.headers['x-batch-errors']).toBe('4');
    const lines = ndjson(res.body as string);
    // Rows are lines of the file: the blank line 4 is skipped but still counted.
    expect(lines.map((l) => [l.row, l.status])).toEqual([
      [2, 'matched'],
      [3, 'error'],
      [5, 'matched'],
      [6, 'error'],
      [7, 'error'],
      [8, 'error'],
      [9, 'matched'],
    ]);
    const errors = Object.fromEntries(
      lines.flatMap((l) => (l.status === 'error' ? [[l.id, l.error]] : [])),
    );
    expect(errors['not-a-number']).toBe("conductivity 'abc' is not a number");
    expect(errors['short-row']).toBe('has 3 cell(s); the header names 5');
    expect(errors['too-hot']).toMatch(/temperature 400 °C is outside −50 °C to 200 °C|outside -50/);
    expect(errors['negative']).toBe('conductivity must be greater than zero');

    const asCsv = await postCsv(csv);
    const row3 = csvRows(asCsv.body as string)[1]!;
    expect(row3).toMatchObject({ row: '3', id: 'not-a-number', status: 'error' });
  });

  it('reads units from a unit column, resistivity, °F and kelvin alike', async () => {
    // 6.16 µΩ·cm is C26000's mill resistivity (as in tests/api/match.test.ts); 68 °F is 20 °C.
    const csv =
      'id,resistivity,resistivity_unit,temperature,temperature_unit\r\n' +
      'a,6.16,uohm_cm,68,F\r\nb,6.16,µΩ·cm,293.15,K\r\nc,6.16,%IACS,20,C\r\n';
    const res = await postCsv(csv, 'application/x-ndjson');
    const [a, b, c] = ndjson(res.body as string);
    expect(a).toMatchObject({ status: 'matched' });
    expect(b).toMatchObject({ status: 'matched' });
    if (a!.status === 'error' || b!.status === 'error') throw new Error('unexpected');
    expect(a!.reading.conductivitySPerM).toBeCloseTo(1 / 6.16e-8, 0);
    expect(a!.candidates[0]!.slug).toBe(b!.candidates[0]!.slug);
    expect(c).toMatchObject({ status: 'error' });
    expect((c as { error: string }).error).toMatch(/'%IACS' is a conductivity unit/);
  });

  it('defuses an id a spreadsheet would run as a formula (OWASP CSV injection)', async () => {
    const res = await postCsv(`${HEADER}\r\n=HYPERLINK(1),25.6,27,8.49,60\r\n`);
    expect(csvRows(res.body as string)[0]!.id).toBe("'=HYPERLINK(1)");
  });

  describe('refused whole, with a clear message', () => {
    it('unknown columns', async () => {
      const res = await postCsv(
        'id,conductivity (%IACS),temperature (C),colour\r\nx,28,20,red\r\n',
      );
      expectProblem(res, 400, /Unknown column\(s\): "colour"\. Expected columns: id, conductivity/);
    });
    it('a missing header', async () => {
      const res = await postCsv('R-1,28,20\r\nR-2,29,20\r\n');
      expectProblem(res, 400, /The first line must name the columns.*header missing/);
    });
    it('a missing column, a missing unit, a wrong unit', async () => {
      expectProblem(
        await postCsv('id,conductivity (%IACS)\r\nx,28\r\n'),
        400,
        /Missing column\(s\): temperature/,
      );
      expectProblem(
        await postCsv('conductivity,temperature (C)\r\n28,20\r\n'),
        400,
        /conductivity needs a unit: write it in the header, e.g. "conductivity \(%IACS\)"/,
      );
      expectProblem(
        await postCsv('conductivity (mS/m),temperature (C)\r\n28,20\r\n'),
        400,
        /'mS\/m' is not a unit of conductivity/,
      );
    });
    it('an empty file, or a header with no readings', async () => {
      expectProblem(await postCsv(''), 400, /empty/);
      expectProblem(await postCsv(`${HEADER}\r\n`), 400, /no readings/);
    });
    it('a CSV that breaks (an unclosed quote)', async () => {
      expectProblem(await postCsv(`${HEADER}\r\n"x,28,20,,\r\n`), 400, /does not parse/);
    });
    it('a binary file, as a body or an upload (415)', async () => {
      // The first bytes of a PNG file (its signature, PNG specification §5.2) and a NUL.
      const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]);
      expectProblem(await postCsv(png), 415, /binary/);
      const res = await integrator.post(URL).attach('file', png, 'photo.csv');
      expectProblem(res, 415, /binary/);
      expectProblem(await postCsv(Buffer.from([0x69, 0x64, 0xff, 0xfe])), 415, /not UTF-8/);
    });
    it('a body of another type (415), an answer of another type (406)', async () => {
      const json = await integrator.post(URL).send({ conductivity: 1 });
      expectProblem(json, 415, /text\/csv body/);
      expectProblem(await postCsv(`${HEADER}\r\nx,28,20,,\r\n`, 'application/json'), 406, /Accept/);
    });
    it('a missing saved plan (404; tests/api/match-batch-plan.test.ts has the rest) and unknown parameters (400)', async () => {
      const plan = await integrator
        .post(`${URL}?plan=999999`)
        .set('Content-Type', 'text/csv')
        .send(`${HEADER}\r\nx,28,20,,\r\n`);
      expectProblem(plan, 404, /No sort plan 999999 of yours/);
      const other = await integrator
        .post(`${URL}?limit=3`)
        .set('Content-Type', 'text/csv')
        .send(`${HEADER}\r\nx,28,20,,\r\n`);
      expectProblem(other, 400, /Unknown query parameter\(s\): limit/);
    });
  });

  describe('limits (413)', () => {
    it(`more than ${MAX_BATCH_ROWS} readings`, async () => {
      const row = 'R,28,20\r\n';
      const csv = `id,conductivity (%IACS),temperature (C)\r\n${row.repeat(MAX_BATCH_ROWS + 1)}`;
      expectProblem(await postCsv(csv), 413, /At most 100,000 readings per batch/);
      // Exactly the cap is accepted (the answer is read here only for its row count).
      const res = await postCsv(
        `id,conductivity (%IACS),temperature (C)\r\n${row.repeat(MAX_BATCH_ROWS)}`,
      );
      expect(res.status).toBe(200);
      expect(res.headers['x-batch-rows']).toBe(String(MAX_BATCH_ROWS));
    }, 60_000);
    it('more than 20 MiB, declared (Content-Length) or counted as it streams', async () => {
      const big = Buffer.alloc(MAX_BATCH_BYTES + 1, 'a');
      expectProblem(await postCsv(big), 413, /at most 20 MiB/);
      // A file of real rows (ids too long, so each is a bad row, but the file goes on) that
      // passes 20 MiB before 100,000 rows: multer's limit or readBatch's count stops it.
      const line = `${'i'.repeat(250)},28,20,,\r\n`;
      const rows = Math.ceil(MAX_BATCH_BYTES / line.length) + 1;
      const file = Buffer.from(`${HEADER}\r\n${line.repeat(rows)}`);
      const upload = await integrator.post(URL).attach('file', file, 'big.csv');
      expect(rows).toBeLessThan(MAX_BATCH_ROWS);
      expectProblem(upload, 413, /20 MiB|File too large/);
      // No length given: readBatch counts the bytes itself.
      const chunks = function* () {
        yield Buffer.from('id,conductivity (%IACS),temperature (C)\r\n');
        for (let sent = 0; sent <= MAX_BATCH_BYTES; sent += 1024 * 1024)
          yield Buffer.from(`x${'y'.repeat(1024 * 1024 - 12)},28,20\r\n`);
      };
      await expect(readBatch(Readable.from(chunks()))).rejects.toMatchObject({
        status: 413,
        detail: expect.stringMatching(/at most 20 MiB/),
      });
    }, 60_000);
  });

  describe('who may call it', () => {
    it('a visitor: 401; a reader: 403', async () => {
      const csv = `${HEADER}\r\nx,28,20,,\r\n`;
      const visitor = await request(t.app).post(URL).set('Content-Type', 'text/csv').send(csv);
      expectProblem(visitor, 401, /Sign in/);
      const reader = await signedIn(t.app, 'reader');
      const res = await reader.post(URL).set('Content-Type', 'text/csv').send(csv);
      expectProblem(res, 403, /reader role may not use POST \/api\/v1\/match\/batch/);
    });
    it('counted as one calculation by the rate limit', async () => {
      const limited = await createTestApp({
        accounts: true,
        estimateLimits: { visitor: 1, reader: 1, integrator: 1, curator: 1, admin: 1 },
      });
      const agent = await signedIn(limited.app, 'integrator');
      const send = () =>
        agent.post(URL).set('Content-Type', 'text/csv').send(`${HEADER}\r\nx,28,20,,\r\n`);
      expect((await send()).status).toBe(200);
      expect((await send()).status).toBe(429);
      await limited.knex.destroy();
    });
  });
});

describe('two batches at once at most', () => {
  it('a third while two are uploading is told to come back (503, Retry-After); then all go on', async () => {
    const server = http.createServer(t.app).listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const { port } = server.address() as AddressInfo;
    const { email, password } = demo('integrator');
    const signIn = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .set('Origin', TEST_PUBLIC_URL)
      .send({ email, password });
    const headers = {
      'Content-Type': 'text/csv',
      Cookie: `conductory_session=${sessionCookieOf(signIn.headers['set-cookie'])}`,
      Origin: TEST_PUBLIC_URL,
    };
    /** A batch whose upload is still going on: the header sent, the rest when finish() is called. */
    const open = () => {
      let finish!: () => void;
      const answer = new Promise<number>((resolve, reject) => {
        const req = http.request(
          { host: '127.0.0.1', port, method: 'POST', path: URL, headers },
          (res) => {
            res.resume();
            res.on('end', () => resolve(res.statusCode!));
          },
        );
        req.on('error', reject);
        req.write(`${HEADER}\r\n`);
        finish = () => req.end('R-102,25.6,27,8.49,60\r\n');
      });
      return { answer, finish: () => finish() };
    };
    const first = open();
    const second = open();
    const third = () =>
      request(server).post(URL).set(headers).send(`${HEADER}\r\nR-103,97.8,27,8.90,60\r\n`);
    // The two take their places as soon as their headers are read; ask until the third is refused.
    let refused: request.Response | undefined;
    const statuses: number[] = [];
    // Under load (PostgreSQL, a busy CI machine) the two can take seconds to get their places.
    for (let attempt = 0; attempt < 300 && !refused; attempt++) {
      const res = await third();
      statuses.push(res.status);
      if (res.status === 503) refused = res;
      else await new Promise((r) => setTimeout(r, 100));
    }
    expect(refused?.headers['retry-after'], `statuses: ${statuses.join(' ')}`).toBe('5');
    expectProblem(refused!, 503, /Other batches are being matched/);
    first.finish();
    second.finish();
    expect(await first.answer).toBe(200);
    expect(await second.answer).toBe(200);
    expect((await third()).status).toBe(200);
    server.close();
  }, 60_000);
});

describe('100,000 readings stream with bounded memory', () => {
  /**
   * The bound: 24 MiB of live heap growth over the whole request (our own figure, no source).
   * What must stay in memory is the readings, column by column: 100,000 × (seven numbers of
   * 8 bytes in arrays + an id of some ten characters as a string + the row's slot in each
   * array) ≈ 10 MiB, and 10.5 MiB is what the probe measured; the rest (a chunk of the upload, a
   * slice of 500 answer lines) is small. The bound leaves some 14 MiB above the readings for
   * buffers and the collector's timing, less than the answer's own 20 MB of NDJSON: an answer
   * held whole before sending breaks it. The probe runs in a process of its own and collects
   * garbage before each sample, so the figure is what the batch holds, not what waits for the
   * collector.
   */
  const BOUND_BYTES = 24 * 1024 * 1024;

  it('sends 100,000 rows in and reads 100,000 lines out; the live heap grows less than 24 MiB', async () => {
    const { stdout } = await run(process.execPath, [
      '--expose-gc',
      '--import',
      'tsx',
      'tests/helpers/batch-memory-probe.ts',
    ]);
    const probe = JSON.parse(stdout.trim().split('\n').at(-1)!) as {
      status: number;
      lines: number;
      bytes: number;
      rows: string;
      heapGrowthBytes: number;
      rssGrowthBytes: number;
    };
    console.log(
      `100,000 readings: answer ${(probe.bytes / 1e6).toFixed(1)} MB of NDJSON; peak growth of the live heap ${(probe.heapGrowthBytes / 2 ** 20).toFixed(1)} MiB (bound ${BOUND_BYTES / 2 ** 20} MiB), of RSS ${(probe.rssGrowthBytes / 2 ** 20).toFixed(1)} MiB`,
    );
    expect(probe.status).toBe(200);
    expect(probe.rows).toBe('100000');
    expect(probe.lines).toBe(MAX_BATCH_ROWS);
    // The answer alone is larger than the margin left above the readings.
    expect(probe.bytes).toBeGreaterThan(BOUND_BYTES - 10 * 2 ** 20);
    expect(probe.heapGrowthBytes).toBeLessThan(BOUND_BYTES);
  }, 300_000);
});
