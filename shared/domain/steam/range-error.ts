/** A clear out-of-range error naming the quantity, the value and the valid range. */
export function outOfRange(quantity: string, value: number, range: string): RangeError {
  return new RangeError(`${quantity} = ${value} is outside the range of validity (${range})`);
}

export function requireFinite(quantity: string, value: number): void {
  if (!Number.isFinite(value)) throw new RangeError(`${quantity} must be a finite number, got ${value}`);
}
