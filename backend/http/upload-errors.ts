import type { ErrorRequestHandler } from 'express';
import multer from 'multer';
import { ProblemError } from './problem';

/** multer's errors as problems: too large is a 413, the rest a 400 naming the field. */
export const uploadErrors: ErrorRequestHandler = (error, _req, _res, next) => {
  if (error instanceof multer.MulterError) {
    const status =
      error.code === 'LIMIT_FILE_SIZE' || error.code === 'LIMIT_FIELD_VALUE' ? 413 : 400;
    return next(
      new ProblemError(
        status,
        status === 413 ? 'Request body too large' : 'Bad request',
        `${error.message}${error.field ? ` (${error.field})` : ''}`,
      ),
    );
  }
  // busboy's own complaints (no boundary, a body cut short) arrive as plain Errors: still the
  // client's malformed upload, not a fault of ours.
  if (error instanceof Error && /^(Multipart|Unexpected end of form|Malformed)/.test(error.message))
    return next(new ProblemError(400, 'Bad request', error.message));
  next(error);
};
