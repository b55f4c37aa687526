/**
 * The air-electrode feed of a carbonate cell made by its own plant: the fuel-electrode off-gas
 * burnt completely with burner air (A mol/s of a fixed composition), mixed with a recycled share
 * r of the air-electrode exhaust. The cells take O2 and CO2 from the gas (c: I/4F of O2 and I/2F
 * of CO2, the carbonate cell's air-electrode reaction CO2 + ½ O2 + 2e⁻ → CO3²⁻). Species by
 * species, at steady state,
 *
 *   n_in = B + A·y + r·(n_in − c)   ⇒   n_in = (B + A·y − r·c) / (1 − r)
 *
 * with y the burner air's mole fractions and B the off-gas burnt completely (C → CO2, H → H2O,
 * N → N2, the noble gases unchanged), which takes D = Σ ṅ_i z_i / 4 of O2 from the air (the
 * oxygen demand, lib/electrochem/charge.ts), so B's O2 is −D. Two conditions fix A and r:
 *
 *   O2 entering, from the air utilization U:   n_in,O2 = c_O2 / U ≡ Q
 *   the O2 mole fraction x at the inlet:       Σ n_in = Q / x ≡ N
 *
 * Taking the O2 row and the sum over species of the balance (Σ y = 1, B summing to N_B − D with
 * N_B the products' moles, c summing to c_t = c_O2 + c_CO2) gives two linear equations:
 *
 *   y_O2 · A + (Q − c_O2) · r = Q + D
 *          A + (N − c_t)  · r = N − N_B + D
 *
 * solved by Cramer's rule. The loop exists where 0 ≤ r < 1; then A = (Q + D − r(Q − c_O2))/y_O2
 * is positive, since Q > c_O2 (U < 1) and D ≥ 0. r < 0 means the burner exhaust alone (r = 0)
 * carries less than the stated O2 fraction: recycling the exhaust, poorer in O2 than the inlet,
 * only dilutes it further. The balance is the law of conservation of mass, element by element;
 * it is linear in the flows, so it holds on any scale. Whatever the exhaust does not recycle
 * (1 − r of it) leaves the loop: none of its water is removed inside it.
 */
import { CalculationError } from '../core/errors.ts';
import { electronsOfElements } from '../electrochem/charge.ts';

/** What the loop is solved from; flows in mol/s on one scale, fractions as plain numbers. */
export interface CathodeLoopRequest {
  /** Elements of the fuel-electrode off-gas that the burner takes, mol/s (symbol → mol/s). */
  offGasElements: Readonly<Record<string, number>>;
  /** The burner air's mole fractions, summing to 1. */
  burnerAir: Readonly<Record<string, number>>;
  /** What the cells take from the air-electrode gas, mol/s (O2 and CO2; positive). */
  take: Readonly<Record<string, number>>;
  /** O2 the cells take over the O2 entering the air electrode, in (0, 1). */
  airUtilization: number;
  /** The O2 mole fraction at the air-electrode inlet. */
  inletOxygenFraction: number;
}

export interface CathodeLoop {
  /** A: burner air, mol/s. */
  burnerAirMolPerS: number;
  /** r: the share of the air-electrode exhaust returned to the inlet. */
  recycledShare: number;
  /** D: O2 that complete combustion of the off-gas takes, mol/s. */
  oxygenDemandMolPerS: number;
  burnerAir: Record<string, number>;
  /** The burner's products: the off-gas burnt with the burner air, mol/s. */
  burnerExhaust: Record<string, number>;
  /** The recycled exhaust, r (n_in − c), mol/s. */
  recycle: Record<string, number>;
  /** The air-electrode inlet, n_in, mol/s. */
  inlet: Record<string, number>;
  /** The air-electrode exhaust, n_in − c, mol/s. */
  outlet: Record<string, number>;
  /** The exhaust leaving the loop, (1 − r)(n_in − c), mol/s. */
  vent: Record<string, number>;
}

/** Complete combustion products of an amount of each element (C → CO2, H → H2O, N → N2, noble gases as they are), mol/s; O2 not included. */
function burntProducts(elements: Readonly<Record<string, number>>): Record<string, number> {
  const products: Record<string, number> = {};
  const add = (species: string, amount: number) => {
    if (amount !== 0) products[species] = (products[species] ?? 0) + amount;
  };
  for (const [element, amount] of Object.entries(elements)) {
    if (element === 'C') add('CO2', amount);
    else if (element === 'H') add('H2O', amount / 2);
    else if (element === 'N') add('N2', amount / 2);
    else if (element === 'Ar' || element === 'He') add(element, amount);
    else if (element !== 'O') throw new CalculationError(`the cathode-gas loop burns C, H, N and O (noble gases pass): the off-gas carries ${element}, whose burnt form is not modelled`, 'cathode-loop');
  }
  return products;
}

function sum(flows: Readonly<Record<string, number>>): number {
  return Object.values(flows).reduce((a, b) => a + b, 0);
}

function linear(parts: [Readonly<Record<string, number>>, number][]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [flows, k] of parts) for (const [s, v] of Object.entries(flows)) out[s] = (out[s] ?? 0) + k * v;
  return out;
}

const PERCENT = (x: number) => `${(100 * x).toPrecision(4)} %`;

/** A and r of the loop (module comment), or a CalculationError naming the inlet O2 fraction where no loop gives it. */
function solveShares(request: CathodeLoopRequest, products: Record<string, number>, demand: number): { A: number; r: number } {
  const { take, airUtilization: U, inletOxygenFraction: x, burnerAir } = request;
  const cO2 = take.O2 ?? 0;
  const yO2 = burnerAir.O2 ?? 0;
  if (!(U > 0 && U < 1)) throw new CalculationError(`the cathode-gas loop needs an air utilization between 0 and 1, got ${U}`, 'cathode-loop');
  if (!(cO2 > 0)) throw new CalculationError('the cathode-gas loop needs cells that take O2 from the air-electrode gas', 'cathode-loop');
  if (!(x > 0 && x < yO2)) throw new CalculationError(`the O2 fraction at the air-electrode inlet must lie between 0 and the burner air's ${PERCENT(yO2)}, got ${PERCENT(x)}`, 'cathode-loop');
  const Q = cO2 / U;
  const N = Q / x;
  const [a11, a12, b1] = [yO2, Q - cO2, Q + demand];
  const [a21, a22, b2] = [1, N - sum(take), N - sum(products) + demand];
  const det = a11 * a22 - a12 * a21;
  const A = (b1 * a22 - a12 * b2) / det;
  const r = (a11 * b2 - b1 * a21) / det;
  if (!(r >= 0)) {
    throw new CalculationError(
      `no cathode-gas recycle gives ${PERCENT(x)} O2 at the air-electrode inlet with the air utilization of ${U}: the burner exhaust alone carries less (the recycle would be ${PERCENT(r)}); lower the inlet O2 fraction or the air utilization (more O2 entering)`,
      'cathode-loop',
    );
  }
  if (!(r < 1) || !(A >= 0)) {
    throw new CalculationError(
      `no cathode-gas recycle gives ${PERCENT(x)} O2 at the air-electrode inlet with the air utilization of ${U}: it would recycle ${Number.isFinite(r) ? PERCENT(r) : 'all'} of the exhaust; raise the inlet O2 fraction or the air utilization`,
      'cathode-loop',
    );
  }
  return { A, r };
}

/** The loop's burner air, recycled share and streams (module comment). */
export function cathodeLoop(request: CathodeLoopRequest): CathodeLoop {
  const products = burntProducts(request.offGasElements);
  const demand = electronsOfElements(request.offGasElements) / 4;
  const { A, r } = solveShares(request, products, demand);
  const burnerAir = linear([[request.burnerAir, A]]);
  const burnerExhaust = linear([[products, 1], [burnerAir, 1], [{ O2: -demand }, 1]]);
  const inlet = linear([[burnerExhaust, 1 / (1 - r)], [request.take, -r / (1 - r)]]);
  const outlet = linear([[inlet, 1], [request.take, -1]]);
  return {
    burnerAirMolPerS: A,
    recycledShare: r,
    oxygenDemandMolPerS: demand,
    burnerAir,
    burnerExhaust,
    recycle: linear([[outlet, r]]),
    inlet,
    outlet,
    vent: linear([[outlet, 1 - r]]),
  };
}
