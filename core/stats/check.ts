// Shared input checks for the statistics functions: exact one-line messages that tests pin.

/** Throws when `values` is empty or holds NaN/±Infinity; `name` prefixes the message. */
export function checkFiniteValues(values: ArrayLike<number>, name: string, minCount = 1): void {
  if (values.length < minCount) {
    throw new RangeError(
      minCount === 1 ? `${name}: no values` : `${name}: need at least ${minCount} values, got ${values.length}`,
    );
  }
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) throw new RangeError(`${name}: value ${i} is not a finite number`);
  }
}

/** Throws unless `level` is strictly between 0 and 1. */
export function checkLevel(level: number, name: string): void {
  if (!(level > 0 && level < 1)) throw new RangeError(`${name}: level must be between 0 and 1 (exclusive), got ${level}`);
}
