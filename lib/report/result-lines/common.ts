/**
 * What the worked lines of section 6 share: the constants F and R as quantities (CODATA 2018)
 * and the citation of an equation by its number.
 */
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../../thermo/constants.ts';
import type { DesignBasis } from '../../basis/types.ts';
import type { QuantitySpec } from '../calc-line.ts';
import type { EquationBook } from '../equation-book.ts';

export const constF: QuantitySpec = { name: 'F', value: F, unit: 'C/mol', origin: 'Faraday constant, CODATA 2018' };
export const constR: QuantitySpec = { name: 'R', value: R, unit: 'J/(mol K)', origin: 'gas constant, CODATA 2018' };

/**
 * The power-conversion efficiency as a quantity of a worked line, saying where it comes from: a
 * design input where the basis gives it, else the value 1 the basis takes when it leaves the
 * converter's loss in the parasitic load (lib/basis/read-operating-point.ts).
 */
export function conversionEfficiency(basis: DesignBasis, value: number): QuantitySpec {
  const converter = basis.cell.mode === 'power' ? 'inverter' : 'rectifier';
  const given = basis.inputs.some((i) => i.path === 'operating-point.power-conversion-efficiency');
  return { name: 'eta', value, unit: '', origin: given ? `power-conversion efficiency (${converter}), design input` : `power-conversion efficiency (${converter}): not in the basis, taken as 1 (its loss counted in the parasitic load)` };
}

export function eqRef(book: EquationBook, key: string): string {
  return `Eq. ${book.get(key).number}`;
}

/** The quantities a relation of an equation names, in the order it names them, taken from `pool`. */
export function quantitiesOf(book: EquationBook, equation: string, relation: string, pool: Readonly<Record<string, QuantitySpec>>): QuantitySpec[] {
  return Object.keys(book.get(equation).entry.relations[relation]!.symbols).map((name) => {
    const q = pool[name];
    if (!q) throw new Error(`no number for ${name} of ${equation}/${relation}`);
    return q;
  });
}

