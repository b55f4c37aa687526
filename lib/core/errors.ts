/**
 * Typed errors that carry a message meant for the user. The CLI prints `userMessage` on one
 * line and exits with `exitCode`; it never prints a stack trace for these.
 *
 * Exit codes (documented in README.md): 0 success, 1 validation or audit failure,
 * 2 usage error (bad option, unknown species, unparsable value), 3 internal error.
 */
export const EXIT_OK = 0;
export const EXIT_VALIDATION = 1;
export const EXIT_USAGE = 2;
export const EXIT_INTERNAL = 3;

export class UserError extends Error {
  readonly exitCode: number;
  constructor(message: string, exitCode: number = EXIT_USAGE) {
    super(message);
    this.name = 'UserError';
    this.exitCode = exitCode;
  }
}

/** A value outside the temperature range where a species record is valid. */
export class TemperatureRangeError extends UserError {
  constructor(
    readonly species: string,
    readonly temperatureK: number,
    readonly lowK: number,
    readonly highK: number,
  ) {
    super(
      `${species}: temperature ${temperatureK.toFixed(2)} K is outside the range of its species data, ${lowK} K to ${highK} K`,
    );
    this.name = 'TemperatureRangeError';
  }
}

/** An iteration that did not converge; names the method, the iterations spent and the residual. */
export class ConvergenceError extends UserError {
  constructor(
    readonly method: string,
    readonly iterations: number,
    readonly residual: number,
    detail = '',
  ) {
    super(
      `${method} did not converge after ${iterations} iterations (residual ${residual.toExponential(2)})${detail ? `: ${detail}` : ''}`,
      EXIT_VALIDATION,
    );
    this.name = 'ConvergenceError';
  }
}

/**
 * The input of a design basis that an error of the calculation concerns. The calculation
 * libraries name it in these words, below the basis format; lib/plant/located-error.ts turns
 * each into the basis field where the message is shown.
 */
export type CalculationInput =
  | 'utilization'
  | 'fuel-electrode-feed'
  | 'air-electrode-feed'
  | 'cell-voltage'
  | 'area-specific-resistance'
  | 'cells'
  | 'ionic-transference-number'
  | 'pre-reforming'
  | 'anode-recycle'
  | 'cathode-loop'
  | 'cells-per-stack'
  | 'stacks-in-series'
  | 'dc-bus-window'
  | 'strings-in-parallel'
  | 'power-conversion-efficiency'
  | 'fuel-supply-temperature'
  | 'air-supply-temperature'
  | 'feed-water-temperature'
  | 'off-gas-oxidiser'
  | 'oxidiser-air-ratio'
  | 'exhaust-exit-temperature'
  | 'hydrogen-compression'
  | 'compressor-inlet-temperature'
  | 'compression-stage-ratio'
  | 'compression-discharge-temperature';

/** An input that passed validation but that the calculation cannot meet: the message says why, `field` which input. */
export class CalculationError extends UserError {
  constructor(
    message: string,
    readonly field: CalculationInput,
  ) {
    super(message);
    this.name = 'CalculationError';
  }
}

