import { InvalidQuantityError, UnknownUnitError } from '../../shared/units/errors';
import { quantityToSI, type Quantity, type QuantityKind } from '../../shared/units/quantity';
import { ProblemError } from './problem';

/**
 * The SI value of a quantity from a request, or a 400 problem naming the field: the OpenAPI
 * schema has already checked shape and unit codes, this catches what only arithmetic can (a
 * temperature below absolute zero, a resistivity of zero).
 */
export function siFromRequest(kind: QuantityKind, quantity: Quantity, path: string): number {
  let si: number;
  try {
    si = quantityToSI(kind, quantity);
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
  // A value the schema allows whose SI form a double cannot hold: 5e-324 µF is 0 F, 1e-300
  // nΩ·m an infinite conductivity. Every calculation after this would divide by it.
  if (!Number.isFinite(si) || (si === 0 && quantity.value !== 0)) {
    const message = `${quantity.value} ${quantity.unit} is too ${si === 0 ? 'small' : 'large'} to express in SI units`;
    throw new ProblemError(400, 'Bad request', message, [{ path: `${path}/value`, message }]);
  }
  return si;
}
