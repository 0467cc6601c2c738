/**
 * Error classes of the engine. Every failure that would otherwise surface as NaN, Infinity or a silent
 * pseudo-inverse is raised as one of these, so the caller can tell the user what to change.
 */

/** Base class: lets callers catch every engine refusal with one `instanceof`. */
export class EngineError extends Error {
  constructor(message: string) {
    super(message);
    this.name = new.target.name;
  }
}

/** Input that the engine cannot use: non-finite numbers, ragged rows, mismatched dimensions. */
export class InvalidInputError extends EngineError {}

/** A group with too few members for the requested statistic (n must exceed p, or p + 1). */
export class GroupTooSmallError extends EngineError {
  constructor(
    readonly group: string,
    readonly n: number,
    readonly p: number,
    readonly minimum: number,
    purpose: string,
  ) {
    super(`group "${group}" has n = ${n} members on p = ${p} variables; ${purpose} needs at least ${minimum} members`);
  }
}

/**
 * A covariance matrix that is singular or too close to singular for a trustworthy D²: a constant
 * variable, a variable that is a linear combination of others (closed compositions without a
 * log-ratio transform are the usual cause), or fewer members than variables.
 */
export class SingularCovarianceError extends EngineError {
  constructor(
    readonly group: string,
    readonly variables: readonly string[],
    detail: string,
  ) {
    super(`covariance of group "${group}" is singular: ${detail}`);
  }
}

/** A value a log or log-ratio transform cannot take (zero, negative) that no replacement rule covered. */
export class NonPositiveValueError extends EngineError {
  constructor(
    readonly row: number,
    readonly column: number,
    readonly value: number,
  ) {
    super(
      `row ${row + 1}, column ${column + 1}: value ${value} cannot be log-transformed; ` +
        'replace zeros and values below the detection limit first',
    );
  }
}
