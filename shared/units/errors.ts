/** Thrown when a unit code is not one this quantity accepts; the message names the choices. */
export class UnknownUnitError extends Error {
  constructor(
    readonly unit: string,
    readonly accepted: readonly string[],
  ) {
    super(`unknown unit '${unit}': use one of ${accepted.join(', ')}`);
    this.name = 'UnknownUnitError';
  }
}

/** Thrown when a value cannot describe a physical quantity (NaN, infinite, or out of its domain). */
export class InvalidQuantityError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InvalidQuantityError';
  }
}
