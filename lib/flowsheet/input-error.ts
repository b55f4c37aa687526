/**
 * A bad input to a flowsheet calculation, naming the field of the request it concerns, so
 * that the caller can locate it in the design basis (the message starts with the field).
 */
import { UserError } from '../core/errors.ts';

export class FlowsheetInputError extends UserError {
  constructor(
    readonly field: string,
    readonly problem: string,
  ) {
    super(`${field} ${problem}`);
    this.name = 'FlowsheetInputError';
  }
}
