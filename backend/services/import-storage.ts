import { parse } from 'csv-parse';
import type { Request } from 'express';
import type { StorageEngine } from 'multer';
import { ProblemError } from '../http/problem';
import { MAX_IMPORT_ROWS } from './imports';

/** JSON has to be whole before it parses; CSV streams, so it may be larger. */
export const MAX_JSON_BYTES = 2 * 1024 * 1024;

export interface ParsedUpload {
  records: Array<Record<string, unknown>>;
  kind: 'csv' | 'json';
}

/** What the storage engine hands on: multer merges it into req.file. */
export type ParsedFile = Express.Multer.File & { upload?: ParsedUpload };

/**
 * A multer storage engine that never stores: it reads the upload as it arrives, refuses binary
 * (a NUL byte) and non-UTF-8 at the first bad chunk, parses CSV record by record through
 * csv-parse's stream and stops at the row cap, so a large file is checked without being held
 * whole and nothing touches the disk. JSON is collected (up to MAX_JSON_BYTES) and parsed at the end.
 */
export const parsingStorage: StorageEngine = {
  _handleFile(_req: Request, file, callback) {
    const decoder = new TextDecoder('utf-8', { fatal: true });
    const records: Array<Record<string, unknown>> = [];
    let mode: 'unknown' | 'csv' | 'json' = 'unknown';
    let jsonText = '';
    let size = 0;
    let failed = false;
    const csv = parse({
      bom: true,
      columns: (h: string[]) => h.map((c) => c.trim().toLowerCase()),
      skip_empty_lines: true,
      trim: true,
      max_record_size: 10_000,
    });
    const fail = (error: Error) => {
      if (failed) return;
      failed = true;
      file.stream.unpipe?.();
      file.stream.resume(); // drain the rest so the request completes
      csv.destroy();
      callback(error);
    };
    csv.on('readable', () => {
      let record: Record<string, unknown> | null;
      while ((record = csv.read()) !== null) {
        records.push(record);
        if (records.length > MAX_IMPORT_ROWS)
          return fail(
            new ProblemError(
              413,
              'Request body too large',
              `At most ${MAX_IMPORT_ROWS} rows per import.`,
            ),
          );
      }
    });
    csv.on('error', (error) =>
      fail(new ProblemError(400, 'Bad request', `The CSV file does not parse: ${error.message}`)),
    );
    file.stream.on('data', (chunk: Buffer) => {
      if (failed) return;
      size += chunk.length;
      if (chunk.includes(0))
        return fail(
          new ProblemError(
            415,
            'Unsupported media type',
            'The file is binary, not CSV or JSON text.',
          ),
        );
      let text: string;
      try {
        text = decoder.decode(chunk, { stream: true });
      } catch {
        return fail(new ProblemError(415, 'Unsupported media type', 'The file is not UTF-8 text.'));
      }
      if (mode === 'unknown') {
        const start = text.replace(/^\uFEFF/, '').trimStart();
        if (start) mode = start.startsWith('[') || start.startsWith('{') ? 'json' : 'csv';
      }
      if (mode === 'json') {
        jsonText += text;
        if (size > MAX_JSON_BYTES)
          fail(
            new ProblemError(
              413,
              'Request body too large',
              `A JSON import may be at most ${MAX_JSON_BYTES / 1024 / 1024} MiB; send larger sets as CSV.`,
            ),
          );
      } else if (mode === 'csv') {
        csv.write(text);
      }
    });
    file.stream.on('error', (error) => fail(error));
    file.stream.on('end', () => {
      if (failed) return;
      if (mode === 'json') {
        let data: unknown;
        try {
          data = JSON.parse(jsonText.replace(/^\uFEFF/, ''));
        } catch (error) {
          return fail(
            new ProblemError(
              400,
              'Bad request',
              `The JSON file does not parse: ${(error as Error).message}`,
            ),
          );
        }
        if (
          !Array.isArray(data) ||
          data.some((r) => typeof r !== 'object' || r === null || Array.isArray(r))
        ) {
          return fail(
            new ProblemError(
              400,
              'Bad request',
              'A JSON import is an array of objects, one per row.',
            ),
          );
        }
        if (data.length > MAX_IMPORT_ROWS)
          return fail(
            new ProblemError(
              413,
              'Request body too large',
              `At most ${MAX_IMPORT_ROWS} rows per import.`,
            ),
          );
        return callback(null, {
          size,
          upload: { records: data as Array<Record<string, unknown>>, kind: 'json' },
        } as Partial<ParsedFile>);
      }
      csv.end(() => {
        if (failed) return;
        callback(null, { size, upload: { records, kind: 'csv' } } as Partial<ParsedFile>);
      });
    });
  },
  _removeFile(_req, _file, callback) {
    callback(null); // nothing was stored
  },
};
