/**
 * Number of cells: given, or the least whole number that meets a target.
 *   power target (power mode, net):   N = ⌈P / (V j A (1 − f_par))⌉
 *   power target (electrolysis, in):  N = ⌈P / (V j A)⌉
 *   hydrogen target:                  N = ⌈ṁ_H2 / ṁ_H2,cell⌉
 * When a cell count and a target are both given they must agree within 2 %.
 */
import type { StackSize } from '../basis/types.ts';
import type { Mode } from '../electrochem/technologies.ts';
import { CalculationError } from '../core/errors.ts';

export const AGREEMENT = 0.02;

export interface Sizing {
  cells: number;
  /** What the count was set from. */
  from: 'cells' | 'power' | 'hydrogen';
  /** With both a cell count and a target: (delivered − target)/target, within ±AGREEMENT. */
  targetGap?: number;
}

/** `perCell` is what one cell delivers of the target's quantity: net W (power), input W (electrolysis) or kg/s of H2. */
export function sizeStack(size: StackSize, statedCells: number | undefined, perCell: number, mode: Mode): Sizing {
  if (size.kind === 'cells') return { cells: size.cells, from: 'cells' };
  const target = size.kind === 'power' ? size.powerW : size.kgPerS;
  if (!(perCell > 0)) throw new CalculationError('one cell delivers nothing at this operating point, so no cell count meets the target', 'cells');
  // At least one cell, however small the target (a target below 1e-9 cells' output rounded to none).
  const needed = Math.max(1, Math.ceil(target / perCell - 1e-9));
  if (statedCells === undefined) return { cells: needed, from: size.kind };
  const delivered = statedCells * perCell;
  const gap = (delivered - target) / target;
  if (Math.abs(gap) > AGREEMENT) {
    const what = size.kind === 'hydrogen' ? `${(delivered * 86400).toFixed(1)} kg/day of hydrogen` : `${(delivered / 1000).toPrecision(4)} kW ${mode === 'power' ? 'net' : 'input'}`;
    const wanted = size.kind === 'hydrogen' ? `${(target * 86400).toFixed(1)} kg/day` : `${(target / 1000).toPrecision(4)} kW`;
    throw new CalculationError(
      `conflicting inputs: ${statedCells} cells give ${what} at this operating point, but the target is ${wanted} (${(Math.abs(gap) * 100).toFixed(1)} % ${gap < 0 ? 'short of' : 'over'} it; they must agree within ${AGREEMENT * 100} %, or give only one of them); ${needed} cells would meet the target`,
      'cells',
    );
  }
  return { cells: statedCells, from: 'cells', targetGap: gap };
}
