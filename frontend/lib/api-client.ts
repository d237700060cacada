import type { Problem } from './api-types';

/** One input the service refused: where (the request field, dotted) and why. */
export interface FieldProblem {
  /** As the service wrote it, e.g. /body/source/citation. */
  path: string;
  /** The request field without its location, dotted: source.citation ('' for the whole body). */
  field: string;
  message: string;
}

/** '/body/source/citation' → 'source.citation'; '/query/q' → 'q'; '/body' → ''. */
export function fieldOfPath(path: string): string {
  return path
    .replace(/^\/(body|query|path|params|headers)(?=\/|$)/, '')
    .split('/')
    .filter(Boolean)
    .join('.');
}

/** Every non-2xx answer becomes one of these, whatever the route. */
export class ApiProblem extends Error {
  constructor(readonly problem: Problem) {
    super(problem.detail ?? problem.title);
    this.name = 'ApiProblem';
  }
  get status(): number {
    return this.problem.status;
  }
  /** The field-level reasons, each (field, message) once: the validator may repeat one. */
  get fieldProblems(): FieldProblem[] {
    const seen = new Set<string>();
    const out: FieldProblem[] = [];
    for (const e of this.problem.errors ?? []) {
      const field = fieldOfPath(e.path);
      const id = `${field}\u0000${e.message}`;
      if (seen.has(id)) continue;
      seen.add(id);
      out.push({ path: e.path, field, message: e.message });
    }
    return out;
  }
}

/** The one place a 401 is noticed: listeners (the session query) learn the person is signed out. */
export const unauthorized = new EventTarget();

async function send<T>(path: string, init?: RequestInit): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      ...init,
      headers: { Accept: 'application/json', ...init?.headers },
    });
  } catch {
    throw new ApiProblem({
      type: 'about:blank',
      title: 'Network error',
      status: 0,
      detail: 'The service did not answer. Is it running?',
    });
  }
  const body = response.headers.get('content-type')?.includes('json')
    ? await response.json()
    : null;
  if (response.status === 401 && !path.startsWith('/api/v1/auth/'))
    unauthorized.dispatchEvent(new Event('401'));
  if (!response.ok) {
    throw new ApiProblem(
      (body as Problem | null) ?? {
        type: 'about:blank',
        title: response.statusText,
        status: response.status,
      },
    );
  }
  return body as T;
}

export function apiGet<T>(path: string, signal?: AbortSignal): Promise<T> {
  return send<T>(path, { signal });
}

export function apiPost<T>(path: string, body: unknown): Promise<T> {
  return send<T>(path, {
    method: 'POST',
    body: JSON.stringify(body),
    headers: { 'Content-Type': 'application/json' },
  });
}

export function apiSend<T>(
  method: 'PUT' | 'PATCH' | 'DELETE',
  path: string,
  body?: unknown,
): Promise<T> {
  return send<T>(path, {
    method,
    ...(body === undefined
      ? {}
      : { body: JSON.stringify(body), headers: { 'Content-Type': 'application/json' } }),
  });
}
