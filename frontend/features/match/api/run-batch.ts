import { useMutation } from '@tanstack/react-query';
import { ApiProblem, unauthorized } from '../../../lib/api-client';
import type { Problem } from '../../../lib/api-types';

/** How far a batch has gone: the upload (0..1), then the answer's lines against X-Batch-Rows. */
export interface BatchProgress {
  uploaded: number;
  /** Readings in the file, known once the service has read it all (X-Batch-Rows). */
  rows: number | null;
  /** Answer lines received so far. */
  received: number;
}

/** The NDJSON answer as received, one line per reading, and its counts. */
export interface BatchAnswer {
  lines: string[];
  rows: number;
  errors: number;
  fileName: string;
  /** The saved plan the readings were classified by (lines are then BatchPlanLine), or null. */
  plan: { id: number; name: string; release: { version: string; checksum: string } } | null;
}

/** A saved plan to classify by instead of ranking the table. */
export interface BatchPlanChoice {
  id: number;
  name: string;
}

/**
 * Sends a CSV of readings to POST /api/v1/match/batch and reads the NDJSON answer. XMLHttpRequest
 * rather than fetch: it reports the upload's progress, and its responseText grows as the answer
 * streams in, so the matching's progress is the lines counted so far. The lines are kept as text
 * and parsed a page at a time by the table.
 */
export function runBatch(
  file: File,
  onProgress: (progress: BatchProgress) => void,
  plan: BatchPlanChoice | null = null,
): Promise<BatchAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const progress: BatchProgress = { uploaded: 0, rows: null, received: 0 };
    let counted = 0;
    xhr.open('POST', plan ? `/api/v1/match/batch?plan=${plan.id}` : '/api/v1/match/batch');
    xhr.setRequestHeader('Accept', 'application/x-ndjson');
    xhr.upload.onprogress = (e) => {
      if (!e.lengthComputable) return;
      progress.uploaded = e.loaded / e.total;
      onProgress({ ...progress });
    };
    xhr.onreadystatechange = () => {
      if (xhr.readyState === XMLHttpRequest.HEADERS_RECEIVED && xhr.status === 200) {
        progress.uploaded = 1;
        progress.rows = Number(xhr.getResponseHeader('X-Batch-Rows'));
        onProgress({ ...progress });
      }
    };
    xhr.onprogress = () => {
      if (xhr.status !== 200) return;
      const text = xhr.responseText;
      for (let i = text.indexOf('\n', counted); i !== -1; i = text.indexOf('\n', i + 1)) {
        progress.received++;
        counted = i + 1;
      }
      onProgress({ ...progress });
    };
    xhr.onload = () => {
      if (xhr.status === 200) {
        const lines = xhr.responseText.split('\n').filter((l) => l !== '');
        const rows = Number(xhr.getResponseHeader('X-Batch-Rows'));
        if (lines.length !== rows)
          return reject(
            new ApiProblem({
              type: 'about:blank',
              title: 'The answer was cut short',
              status: 0,
              detail: `${lines.length} of ${rows} readings came back. Try again.`,
            }),
          );
        return resolve({
          lines,
          rows,
          errors: Number(xhr.getResponseHeader('X-Batch-Errors')),
          fileName: file.name,
          plan: plan && {
            ...plan,
            release: {
              version: xhr.getResponseHeader('X-Plan-Release') ?? '',
              checksum: xhr.getResponseHeader('X-Plan-Release-Checksum') ?? '',
            },
          },
        });
      }
      if (xhr.status === 401) unauthorized.dispatchEvent(new Event('401'));
      let body: Problem | null = null;
      try {
        body = JSON.parse(xhr.responseText) as Problem;
      } catch {
        // not JSON: handled below
      }
      reject(
        new ApiProblem(body ?? { type: 'about:blank', title: xhr.statusText, status: xhr.status }),
      );
    };
    xhr.onerror = () =>
      reject(
        new ApiProblem({
          type: 'about:blank',
          title: 'Network error',
          status: 0,
          detail: 'The file did not reach the service, or its answer did not come back.',
        }),
      );
    const form = new FormData();
    form.append('file', file);
    xhr.send(form);
  });
}

/** A batch is a computation, not a stored thing: a mutation, run afresh on each upload. */
export function useRunBatch(onProgress: (progress: BatchProgress) => void) {
  return useMutation({
    mutationFn: ({ file, plan }: { file: File; plan: BatchPlanChoice | null }) =>
      runBatch(file, onProgress, plan),
  });
}
