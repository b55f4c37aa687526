/** Command-line values with units, parsed at the edge (see lib/core/units.ts). */
import { parseQuantity, UnitError, type Dimension } from '../core/units.ts';
import { UserError } from '../core/errors.ts';

function quantityOption(text: string, dimension: Dimension, option: string): number {
  try {
    return parseQuantity(text, dimension).si;
  } catch (error) {
    if (error instanceof UnitError) throw new UserError(`--${option}: ${error.message}`);
    throw error;
  }
}

export function temperatureOption(text: string, option = 'temperature'): number {
  const kelvin = quantityOption(text, 'temperature', option);
  if (!(kelvin > 0)) throw new UserError(`--${option}: ${text} is at or below absolute zero`);
  return kelvin;
}

/** Pressure option, returned in bar (absolute). */
export function pressureOption(text: string, option = 'pressure'): number {
  const pa = quantityOption(text, 'pressure', option);
  if (!(pa > 0)) throw new UserError(`--${option}: ${text} is not a positive absolute pressure`);
  return pa / 1e5;
}
