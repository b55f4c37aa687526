/**
 * The operating voltage of a cell with one voltage over its whole area (the uniform-voltage cell
 * of a stack whose plates are good conductors) and a lumped area-specific resistance ASR.
 *
 * The electrolyte is modelled as an ionic branch in parallel with an electronic one (a mixed
 * conductor with ionic transference number t_ion ≤ 1; the equivalent circuit of e.g.
 * M. Gödickemeier and L. J. Gauckler, J. Electrochem. Soc. 145 (1998) 414, from memory): the
 * cell's open-circuit voltage is t_ion E − ΔV_x (ΔV_x the basis's crossover allowance, power
 * mode only), its resistance at the terminals is the ASR, so the ionic branch has ASR/t_ion and
 * the electronic branch ASR/(1 − t_ion). At a point u of the fuel path (u = charge carried by the
 * ions over the charge basis, so that fuel, water and oxygen follow the ionic current):
 *
 *   power:         i_ion(u) = (t_ion E(u) − ΔV_x − t_ion V) / ASR      i_e = (1 − t_ion) V / ASR
 *                  i(u) = i_ion(u) − i_e = (t_ion E(u) − ΔV_x − V) / ASR   (at the terminals)
 *   electrolysis:  i_ion(u) = t_ion (V − E(u)) / ASR                   i(u) = i_ion(u) + i_e = (V − t_ion E(u)) / ASR
 *
 * The area that carries the ionic charge from u to u + du is dA = Q du / i_ion(u) (Q the charge
 * basis), so the mean ionic current density is the harmonic mean of the local one, and with the
 * mean current density j at the terminals (the design input; the leakage i_e is the same
 * everywhere, V being uniform):
 *
 *   power:         U / ∫₀^U du/(t_ion E(u) − ΔV_x − t_ion V) = j ASR + (1 − t_ion) V       (1)
 *   electrolysis:  U / ∫₀^U du/(t_ion V − t_ion E(u))     = j ASR − (1 − t_ion) V       (2)
 *
 * For t_ion = 1: U/(j ASR) = ∫₀^U du/(E(u) − ΔV_x − V). Averaging i(u) over the area gives the
 * same law as V = t_ion Ē_A − ΔV_x − j ASR (power) or V = t_ion Ē_A + j ASR (electrolysis), with
 * Ē_A = ∫ E dA / A the area-mean Nernst voltage; where E is the same all along, V = E − j ASR.
 * The charge mean Ē = (1/U) ∫ E du (lib/equilibrium/path-integral.ts) is the Gibbs energy per
 * charge of the reaction; it overstates the voltage of a cell whose outlet, where E is low, draws
 * less current and needs more area. The basis gives V (then (1) or (2) is explicit in ASR, the
 * implied resistance) or the ASR (then V is the root of (1) or (2), each side monotone in V).
 *
 * Reachable points: the ionic current must keep its sign to the outlet, t_ion V < min(t_ion E −
 * ΔV_x) in power mode and V > max E in electrolysis; otherwise it reverses before the utilization
 * is reached. A given voltage outside that, a resistance giving V ≤ 0, and a mixed conductor whose
 * leakage leaves no net current are refused at the field they concern.
 *
 * With the activation loss of the basis (activation.ts), the local current density of a purely
 * ionic cell (t_ion = 1; a mixed conductor with it is refused) solves instead
 *
 *   power:         E(u) − ΔV_x − η_act(i) − i ASR = V
 *   electrolysis:  E(u) + η_act(i) + i ASR = V                                              (3)
 *
 * and the mean current density is again U / ∫₀^U du / i(u) = j. The basis gives V (then ASR is the
 * root of that, between 0 and the resistance (1) or (2) implies without the loss: the implied
 * resistance is what is left of the loss at the design point once the activation loss is taken
 * out) or the ASR (then V is the root, each side monotone in V). Averaging (3) over the area gives
 * V = Ē_A − ΔV_x − η̄_A − j ASR (power) or V = Ē_A + η̄_A + j ASR (electrolysis), with η̄_A the
 * area-mean activation loss: the loss breakdown of the design point. Without the activation loss
 * every number is that of (1) and (2), by the same code.
 */
import type { Mode } from '../electrochem/technologies.ts';
import type { ActivationLoss, ResistanceLaw, VoltageModel } from '../basis/types.ts';
import { KineticCell, kineticIntegral, kineticSums } from './activation.ts';
import { GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { reciprocalIntegral, reciprocalSums, type Profile, type ReciprocalIntegral, type ReciprocalSums } from '../equilibrium/path-integral.ts';
import { CalculationError, type CalculationInput } from '../core/errors.ts';

/**
 * The voltage model at temperature T: a given area-specific resistance follows its Arrhenius law,
 * ASR(T) = ASR(T_ref) exp[(E_a/R)(1/T − 1/T_ref)] (thermally activated conduction and electrode
 * kinetics, the usual engineering form; e.g. R. O'Hayre et al., Fuel Cell Fundamentals, 3rd ed.,
 * ch. 4, for the conductivity of solid electrolytes), T_ref resolved by design-inputs.ts; without
 * a law, or with the voltage given, the model is unchanged.
 */
export function voltageModelAt(model: VoltageModel, law: ResistanceLaw | undefined, temperatureK: number): VoltageModel {
  if (model.kind === 'given' || !law) return model;
  const reference = law.referenceTemperatureK!;
  return { kind: 'area-specific-resistance', ohmM2: model.ohmM2 * Math.exp((law.activationEnergyJPerMol / R) * (1 / temperatureK - 1 / reference)) };
}

export interface CellVoltageRequest {
  mode: Mode;
  model: VoltageModel;
  /** E(u) along the fuel path. */
  profile: Profile;
  /** Design fuel utilization or steam conversion U (the end of the profile). */
  utilization: number;
  /** Mean current density at the terminals, A/m². */
  currentDensityAPerM2: number;
  ionicTransferenceNumber: number;
  /** Subtracted from the open-circuit voltage in power mode, V. */
  crossoverAllowanceV: number;
  /** Nernst voltage at the inlet as reported (lib/equilibrium/fuel-path.ts), V. */
  inletNernstV: number;
  /** The reported points of the fuel path, for the local current density along the cell. */
  points: readonly { utilization: number; nernstV: number }[];
  /** The activation loss of the electrodes, (3); absent: none. */
  activation?: ActivationLoss;
}

export interface LocalPoint {
  utilization: number;
  /** Share of the cell's active area from the inlet to this point. */
  areaFraction: number;
  /** Local current density at the terminals, i(u), A/m². */
  currentDensityAPerM2: number;
}

export interface OperatingVoltage {
  cellVoltageV: number;
  /** Area-mean driving voltage: t_ion Ē_A − ΔV_x (power) or t_ion Ē_A (electrolysis), V. */
  effectiveNernstV: number;
  /** Area-mean Nernst voltage Ē_A = ∫E dA / A, V. */
  areaMeanNernstV: number;
  /** Open-circuit voltage at the inlet: t_ion E_in − ΔV_x (power) or t_ion E_in (electrolysis), V. */
  openCircuitV: number;
  /** Area-specific resistance used or implied, ohm m². */
  areaSpecificResistanceOhmM2: number;
  source: 'given' | 'area-specific-resistance';
  /** ∫₀^U du/y(u) of (1) or (2), with y the ionic driving voltage, 1/V. */
  harmonicIntegralPerV: number;
  /** Mean ionic current density (it sets the flows by Faraday's law) and the electronic leakage, A/m². */
  ionicCurrentDensityAPerM2: number;
  leakageCurrentDensityAPerM2: number;
  /** The local current density at the reported points of the fuel path, and its highest value. */
  local: LocalPoint[];
  maxLocalCurrentDensityAPerM2: number;
  /** With the activation loss: its area mean η̄_A and the ohmic loss j ASR, V. */
  losses?: { activationV: number; ohmicV: number };
}

/** What the physics fixes once the mode and the cell are known: y(u) = a E(u) + b(V) is the ionic driving voltage. */
class Cell {
  readonly power: boolean;
  readonly t: number;
  readonly dV: number;
  constructor(readonly request: CellVoltageRequest) {
    this.power = request.mode === 'power';
    this.t = request.ionicTransferenceNumber;
    this.dV = this.power ? request.crossoverAllowanceV : 0;
  }

  /** y = t E − ΔV_x − t V (power) or t V − t E (electrolysis). */
  coefficients(v: number): [number, number] {
    return this.power ? [this.t, -this.dV - this.t * v] : [-this.t, this.t * v];
  }

  integral(v: number): ReciprocalIntegral | null {
    const [a, b] = this.coefficients(v);
    return reciprocalIntegral(this.request.profile, a, b);
  }

  /** The integral's two sums alone, for the root searches (the same numbers). */
  sums(v: number): ReciprocalSums | null {
    const [a, b] = this.coefficients(v);
    return reciprocalSums(this.request.profile, a, b);
  }

  /** The voltage at which the ionic current reaches zero somewhere on the path: min(E − ΔV_x/t) (power) or max E (electrolysis). */
  reversibleLimitV(): number {
    const e = this.request.profile.value;
    let limit = this.power ? Infinity : -Infinity;
    for (const x of e) limit = this.power ? Math.min(limit, x - this.dV / this.t) : Math.max(limit, x);
    for (const p of this.request.points) limit = this.power ? Math.min(limit, p.nernstV - this.dV / this.t) : Math.max(limit, p.nernstV);
    return limit;
  }

  /** j ASR as (1) or (2) gives it at voltage v: U/I ∓ (1 − t) v. */
  resistanceTimesJ(v: number, integral: ReciprocalSums): number {
    const u = this.request.utilization;
    return this.power ? u / integral.first - (1 - this.t) * v : u / integral.first + (1 - this.t) * v;
  }
}

const fmt = (v: number) => v.toFixed(4);
const pct = (x: number) => `${(x * 100).toPrecision(4)} %`;

/**
 * The root of a function that is monotone on (lo, hi) and changes sign there, by Newton's method
 * kept inside the bracket (bisection where a step leaves it), to 1e-12 V.
 */
function solveMonotone(f: (x: number) => { value: number; slope: number }, lo: number, hi: number, increasing: boolean, start = (lo + hi) / 2): number {
  let x = start > lo && start < hi ? start : (lo + hi) / 2;
  for (let k = 0; k < 200; k++) {
    const { value, slope } = f(x);
    if (value === 0) return x;
    if ((value > 0) === increasing) hi = x;
    else lo = x;
    let next = x - value / slope;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - x) < 1e-13 || hi - lo < 1e-13) return next;
    x = next;
  }
  return x;
}

function voltageField(model: VoltageModel): CalculationInput {
  return model.kind === 'given' ? 'cell-voltage' : 'area-specific-resistance';
}

function utilizationText(mode: Mode, u: number): string {
  return mode === 'power' ? `the fuel utilization ${pct(u)}` : `the steam conversion ${pct(u)}`;
}

/** (1) or (2) solved for V at the resistance ASR (power: the highest voltage with positive ionic current is the limit). */
function solveVoltage(cell: Cell, asr: number, limit: number): number {
  const { currentDensityAPerM2: j, utilization: u } = cell.request;
  const t = cell.t;
  // g(V) = U/I(V) − j ASR ∓ (1 − t) V; dI/dV = ±t ∫du/y².
  const g = (v: number) => {
    const integral = cell.sums(v);
    // At the limit to rounding (the ionic driving voltage no longer positive at some sample) U/I is 0.
    if (!integral) return { value: -j * asr + (cell.power ? -(1 - t) * v : (1 - t) * v), slope: cell.power ? -1 : 1 };
    const dI = (cell.power ? t : -t) * integral.second;
    const value = u / integral.first - j * asr + (cell.power ? -(1 - t) * v : (1 - t) * v);
    const slope = (-u * dI) / (integral.first * integral.first) + (cell.power ? -(1 - t) : 1 - t);
    return { value, slope };
  };
  if (cell.power) {
    // g falls from +∞ (V → −∞) to −j ASR − (1 − t) V (V → the limit, where U/I → 0).
    let step = 1;
    let lo = limit - step;
    while (g(lo).value <= 0) {
      step *= 2;
      lo = limit - step;
    }
    return solveMonotone(g, lo, limit, false);
  }
  // Electrolysis: g rises from −j ASR + (1 − t) V at the limit to +∞.
  const atLimit = -j * asr + (1 - t) * limit;
  if (atLimit >= 0) {
    throw new CalculationError(
      `with an ionic transference number of ${t} the electronic leakage at the Nernst voltage ${fmt(limit)} V, (1 − t_ion)·E/ASR = ${((1 - t) * limit / asr / 1e4).toPrecision(4)} A/cm2, already carries the whole current density ${(j / 1e4).toPrecision(4)} A/cm2: no current would be left to split water`,
      'ionic-transference-number',
    );
  }
  let step = (j * asr) / t + 1e-3;
  let hi = limit + step;
  while (g(hi).value <= 0) {
    step *= 2;
    hi = limit + step;
  }
  return solveMonotone(g, limit, hi, true);
}

/**
 * The resistance a given cell voltage implies by (1): ASR = (U/I(V) ∓ (1 − t) V)/j. A voltage the
 * reversible limit leaves unreachable, or one whose electronic leakage exceeds the ionic current
 * at any resistance, is refused at the field that gives it.
 */
function impliedResistance(cell: Cell, v: number, limit: number): number {
  const { mode, model, currentDensityAPerM2: j, utilization: u } = cell.request;
  const t = cell.t;
  const reachable = cell.power ? v < limit : v > limit;
  const integral = reachable ? cell.sums(v) : null;
  if (!integral) {
    const where = cell.power
      ? `not below the lowest Nernst voltage available along the cell, ${t < 1 || cell.dV > 0 ? 'E − ΔV_x/t_ion = ' : ''}${fmt(limit)} V`
      : `not above the highest Nernst voltage along the cell, ${fmt(limit)} V`;
    throw new CalculationError(
      `the cell voltage ${fmt(v)} V is ${where}: the local current would reverse before ${utilizationText(mode, u)} is reached (${mode === 'power' ? 'lower the cell voltage or the fuel utilization' : 'raise the cell voltage or lower the steam conversion'})`,
      voltageField(model),
    );
  }
  const asr = cell.resistanceTimesJ(v, integral) / j;
  if (!(asr > 0)) {
    // Power mode with t < 1: the leakage (1 − t) V/ASR exceeds the ionic current at any resistance.
    const h = (x: number) => {
      const i = cell.sums(x);
      if (!i) return { value: -(1 - t) * x, slope: -1 };
      return { value: u / i.first - (1 - t) * x, slope: -(u * t * i.second) / (i.first * i.first) - (1 - t) };
    };
    const highest = solveMonotone(h, 0, limit, false);
    throw new CalculationError(
      `the cell voltage ${fmt(v)} V leaves no net current: with an ionic transference number of ${t} the electronic leakage at this voltage exceeds the ionic current at any resistance (the implied area-specific resistance would be ${(asr * 1e4).toPrecision(4)} ohm cm2); below ${fmt(highest)} V a net current flows`,
      voltageField(model),
    );
  }
  return asr;
}

/** The cell voltage and resistance: the given voltage with the resistance it implies, or the voltage (1) or (2) gives at the given resistance. */
function voltageAndResistance(cell: Cell, limit: number): { v: number; asr: number } {
  const { model } = cell.request;
  if (model.kind === 'given') return { v: model.cellVoltageV, asr: impliedResistance(cell, model.cellVoltageV, limit) };
  const asr = model.ohmM2;
  const v = solveVoltage(cell, asr, limit);
  if (cell.power && !(v > 0)) {
    throw new CalculationError(`the resistance gives a cell voltage of ${fmt(v)} V at this current density: lower the current density or the area-specific resistance`, voltageField(model));
  }
  return { v, asr };
}

/** The voltage and its integral ∫du/y: a root at the limit to rounding moves to the nearest voltage inside it (power: below; electrolysis: above). */
function insideLimit(cell: Cell, solvedV: number, limit: number): { v: number; integral: ReciprocalSums } {
  let v = solvedV;
  let integral = cell.sums(v);
  for (let step = 1e-15; !integral && step < 1e-6; step *= 10) {
    v = cell.power ? limit - step * Math.max(1, Math.abs(limit)) : limit + step * Math.max(1, Math.abs(limit));
    integral = cell.sums(v);
  }
  if (!integral) throw new Error(`the cell voltage ${v} V lies outside the reversible limit ${limit} V`);
  return { v, integral };
}

/**
 * The local current density i(u) = (t E − ΔV_x − V)/ASR (power) or (V − t E)/ASR at the reported
 * points, with the share of the area up to each (the running integral at v, which insideLimit
 * found positive there: the same sums, term for term).
 */
function localCurrents(cell: Cell, v: number, asr: number): LocalPoint[] {
  const t = cell.t;
  return localPoints(cell, cell.integral(v)!, (e) => (cell.power ? (t * e - cell.dV - v) / asr : (v - t * e) / asr));
}

/** The local points from the running integral ∫₀^u du/i and the local current density at a Nernst voltage. */
function localPoints(cell: Cell, integral: { first: number; cumulative: Float64Array }, current: (nernstV: number) => number): LocalPoint[] {
  const samples = new Map<number, number>();
  cell.request.profile.utilization.forEach((x, k) => samples.set(x, integral.cumulative[k]!));
  return cell.request.points.map((p) => ({
    utilization: p.utilization,
    areaFraction: p.utilization === 0 ? 0 : samples.get(p.utilization)! / integral.first,
    currentDensityAPerM2: current(p.nernstV),
  }));
}

/** (3) solved for V at the resistance ASR: U/∫du/i(V) − j, falling in V in power mode, rising in electrolysis. */
function solveKineticVoltage(cell: Cell, loss: ActivationLoss, asr: number, limit: number): number {
  const { currentDensityAPerM2: j, utilization: u, profile } = cell.request;
  const kinetic = new KineticCell(loss, asr);
  const g = (v: number) => {
    const [a, b] = cell.coefficients(v);
    const sums = kineticSums(profile, kinetic, a, b);
    if (!sums) return { value: -j, slope: cell.power ? -1 : 1 };
    // dy/dV = −1 (power) or +1: d∫du/i / dV = ±∫du/(i² g').
    const dI = cell.power ? sums.perVolt : -sums.perVolt;
    return { value: u / sums.first - j, slope: (-u * dI) / (sums.first * sums.first) };
  };
  // The losses at the mean current density, j ASR + η(j), below the limit: a first guess near the root, and a bracket once doubled until it holds.
  const losses = j * asr + kinetic.overpotential(j);
  let step = losses + 1e-3;
  if (cell.power) {
    while (g(limit - step).value <= 0) step *= 2;
    return solveMonotone(g, limit - step, limit, false, limit - losses);
  }
  while (g(limit + step).value <= 0) step *= 2;
  return solveMonotone(g, limit, limit + step, true, limit + losses);
}

/**
 * The resistance a given voltage implies by (3): the root in (0, ASR_ohm) of U/∫du/i(ASR) = j, with
 * ASR_ohm the resistance (1) or (2) implies without the loss (its checks of the voltage apply).
 */
function kineticImpliedResistance(cell: Cell, loss: ActivationLoss, v: number, limit: number): number {
  const { model, currentDensityAPerM2: j, utilization: u, profile } = cell.request;
  const ohmic = impliedResistance(cell, v, limit);
  const [a, b] = cell.coefficients(v);
  const f = (asr: number) => {
    const sums = kineticSums(profile, new KineticCell(loss, asr), a, b)!;
    return { value: u / sums.first - j, slope: (-u * sums.perOhm) / (sums.first * sums.first) };
  };
  const bare = f(0).value + j;
  if (!(bare > j)) {
    throw new CalculationError(
      `at the cell voltage ${fmt(v)} V the activation loss alone (Tafel slope ${(loss.tafelSlopeVPerDecade * 1e3).toPrecision(4)} mV per decade, exchange current density ${(loss.exchangeCurrentDensityAPerM2 / 1e4).toPrecision(4)} A/cm2) allows a mean current density of ${(bare / 1e4).toPrecision(4)} A/cm2, not the ${(j / 1e4).toPrecision(4)} A/cm2 of the design: no resistance is left (${cell.power ? 'lower' : 'raise'} the cell voltage or review the activation loss)`,
      voltageField(model),
    );
  }
  return solveMonotone(f, 0, ohmic, false);
}

/** The cell voltage and resistance of (3), as voltageAndResistance gives those of (1) and (2). */
function kineticVoltageAndResistance(cell: Cell, loss: ActivationLoss, limit: number): { v: number; asr: number } {
  const { model } = cell.request;
  if (cell.t !== 1) {
    throw new CalculationError(
      `the activation loss is modelled for a purely ionic electrolyte: with an ionic transference number of ${cell.t} give no operating-point.activation-loss (or a transference number of 1)`,
      'ionic-transference-number',
    );
  }
  if (model.kind === 'given') return { v: model.cellVoltageV, asr: kineticImpliedResistance(cell, loss, model.cellVoltageV, limit) };
  const v = solveKineticVoltage(cell, loss, model.ohmM2, limit);
  if (cell.power && !(v > 0)) {
    throw new CalculationError(`the resistance and the activation loss give a cell voltage of ${fmt(v)} V at this current density: lower the current density or the area-specific resistance`, voltageField(model));
  }
  return { v, asr: model.ohmM2 };
}

/**
 * The operating voltage of (3): the voltage and resistance, the area means (η̄_A by the integral
 * ∫η du/i, Ē_A from the averaged (3)) and the local current densities.
 */
function kineticOperatingVoltage(cell: Cell, loss: ActivationLoss, limit: number, source?: OperatingVoltage['source']): OperatingVoltage {
  const { model, currentDensityAPerM2: j, profile } = cell.request;
  const { v: solvedV, asr } = kineticVoltageAndResistance(cell, loss, limit);
  const { v } = insideLimit(cell, solvedV, limit);
  const kinetic = new KineticCell(loss, asr);
  const [a, b] = cell.coefficients(v);
  const integral = kineticIntegral(profile, kinetic, a, b)!;
  const activationV = integral.overpotential / integral.first;
  const ohmicV = j * asr;
  const areaMeanNernstV = cell.power ? v + cell.dV + activationV + ohmicV : v - activationV - ohmicV;
  // Sample by sample along the path: each root search starts from the one before (KineticCell.current).
  const local = localPoints(cell, integral, (e) => kinetic.current(a * e + b, kinetic.eta));
  return {
    cellVoltageV: v,
    effectiveNernstV: cell.power ? areaMeanNernstV - cell.dV : areaMeanNernstV,
    areaMeanNernstV,
    openCircuitV: cell.request.inletNernstV - cell.dV,
    areaSpecificResistanceOhmM2: asr,
    source: source ?? (model.kind === 'given' ? 'given' : 'area-specific-resistance'),
    harmonicIntegralPerV: integral.first / asr,
    ionicCurrentDensityAPerM2: j,
    leakageCurrentDensityAPerM2: 0,
    local,
    maxLocalCurrentDensityAPerM2: Math.max(...local.map((p) => p.currentDensityAPerM2)),
    losses: { activationV, ohmicV },
  };
}

/**
 * The cell voltage and resistance, or the resistance implied by a given voltage, by (1) or (2),
 * with the area means and the local current density along the cell; `source` in place of the
 * model's where the caller states it (an aged cell keeps the source of the new one). The local
 * current densities are found when first read: a root search over the current density reads only
 * the voltage, and the same numbers come out either way.
 */
export function operatingVoltage(request: CellVoltageRequest, source?: OperatingVoltage['source']): OperatingVoltage {
  const cell = new Cell(request);
  const { model, currentDensityAPerM2: j, utilization: u } = request;
  const t = cell.t;
  const limit = cell.reversibleLimitV();
  if (request.activation) return kineticOperatingVoltage(cell, request.activation, limit, source);
  const { v: solvedV, asr } = voltageAndResistance(cell, limit);
  const { v, integral } = insideLimit(cell, solvedV, limit);
  const [a, b] = cell.coefficients(v);
  // Ē_A = ∫E du/y / ∫du/y with y = aE + b: ∫E/y du = (U − b I)/a.
  const areaMeanNernstV = (u - b * integral.first) / a / integral.first;
  const leakage = ((1 - t) * v) / asr;
  const ionic = cell.power ? j + leakage : j - leakage;
  const effectiveNernstV = cell.power ? t * areaMeanNernstV - cell.dV : t * areaMeanNernstV;
  let local: LocalPoint[] | null = null;
  const localOf = () => (local ??= localCurrents(cell, v, asr));
  return {
    cellVoltageV: v,
    effectiveNernstV,
    areaMeanNernstV,
    openCircuitV: t * request.inletNernstV - cell.dV,
    areaSpecificResistanceOhmM2: asr,
    source: source ?? (model.kind === 'given' ? 'given' : 'area-specific-resistance'),
    harmonicIntegralPerV: integral.first,
    ionicCurrentDensityAPerM2: ionic,
    leakageCurrentDensityAPerM2: leakage,
    get local() {
      return localOf();
    },
    get maxLocalCurrentDensityAPerM2() {
      return Math.max(...localOf().map((p) => p.currentDensityAPerM2));
    },
  };
}
