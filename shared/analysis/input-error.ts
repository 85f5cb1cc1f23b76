/**
 * Error thrown by Seepwise's pure calculations when the input cannot give a meaningful
 * answer (unequal lengths, too few values, non-finite numbers, non-positive denominators).
 * Callers (server validation, UI) can test `instanceof AnalysisInputError` and show
 * `message` to the person as it is.
 */
export class AnalysisInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AnalysisInputError';
  }
}

/** Throws unless every value is a finite number. */
export function assertFiniteValues(name: string, values: readonly number[]): void {
  values.forEach((value, index) => {
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new AnalysisInputError(`${name}[${index}] must be a finite number (got ${String(value)}).`);
    }
  });
}

/** Throws unless the value is a finite number. */
export function assertFinite(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new AnalysisInputError(`${name} must be a finite number (got ${String(value)}).`);
  }
}

/** Throws unless the value is a finite number greater than zero. */
export function assertPositive(name: string, value: number): void {
  assertFinite(name, value);
  if (value <= 0) {
    throw new AnalysisInputError(`${name} must be greater than zero (got ${value}).`);
  }
}

/** Throws unless the value is a finite number of zero or more. */
export function assertNonNegative(name: string, value: number): void {
  assertFinite(name, value);
  if (value < 0) {
    throw new AnalysisInputError(`${name} must not be negative (got ${value}).`);
  }
}

/** Throws unless 0 < value < 1 (confidence levels, alpha, power). */
export function assertProbability(name: string, value: number): void {
  assertFinite(name, value);
  if (value <= 0 || value >= 1) {
    throw new AnalysisInputError(`${name} must be strictly between 0 and 1 (got ${value}).`);
  }
}
