import { InvalidQuantityError, UnknownUnitError } from '../../shared/units/errors';
import { quantityToSI, type Quantity, type QuantityKind } from '../../shared/units/quantity';
import { ProblemError } from './problem';

/**
 * The SI value of a quantity from a request, or a 400 problem naming the field: the OpenAPI
 * schema has already checked shape and unit codes, this catches what only arithmetic can (a
 * temperature below absolute zero, a resistivity of zero).
 */
export function siFromRequest(kind: QuantityKind, quantity: Quantity, path: string): number {
  try {
    return quantityToSI(kind, quantity);
  } catch (error) {
    if (error instanceof UnknownUnitError) {
      throw new ProblemError(400, 'Bad request', error.message, [
        { path: `${path}/unit`, message: error.message },
      ]);
    }
    if (error instanceof InvalidQuantityError) {
      throw new ProblemError(400, 'Bad request', error.message, [
        { path: `${path}/value`, message: error.message },
      ]);
    }
    throw error;
  }
}
