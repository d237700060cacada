/**
 * Thrown when an input is valid as a number but lies outside the range where a model holds (a
 * reading far below room temperature for a linear temperature coefficient, a circuit too small
 * to ring at any frequency). The API answers it with a 422 naming `field`.
 *
 * It may cross a worker-thread boundary, where only plain fields survive: callers recognise it
 * by `name === 'OutsideModelError'` and read `field` and `message`, never by `instanceof`.
 */
export class OutsideModelError extends Error {
  constructor(
    /** JSON pointer of the offending input under /body, e.g. /body/bank/capacitance; '/body' when no one field is to blame. */
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'OutsideModelError';
  }
}

/** True for an OutsideModelError, or for the plain object one becomes after a thread boundary. */
export function isOutsideModelError(
  error: unknown,
): error is { name: string; field: string; message: string } {
  const e = error as { name?: unknown; field?: unknown; message?: unknown } | null;
  return (
    typeof e === 'object' &&
    e !== null &&
    e.name === 'OutsideModelError' &&
    typeof e.field === 'string' &&
    typeof e.message === 'string'
  );
}
