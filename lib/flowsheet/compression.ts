/**
 * Gas compression in N stages of equal pressure ratio with intercooling: the shaft work given
 * to the gas, each stage's outlet temperature and the heat the coolers remove.
 *
 * Per stage k (inlet T_k, p_k; outlet p_k+1 = r p_k with r = (p_out/p_in)^(1/N)), for an ideal
 * gas of fixed composition with the species data's c_p(T) (NASA polynomials):
 *   isentropic outlet T_s:  Σ y_i s°_i(T_s) = Σ y_i s°_i(T_k) + R ln r       (Δs = 0)
 *   work per mol:           w_k = [h(T_s) − h(T_k)] / η_s                     (isentropic efficiency)
 *   actual outlet T_k,out:  h(T_k,out) = h(T_k) + w_k                         (adiabatic stage)
 *   cooler after stage k:   Q_k = ṅ [h(T_k,out) − h(T_cool)]
 * Stage 1 takes the gas at its inlet temperature; stages 2..N after an intercooler at T_cool;
 * an after-cooler after the last stage when a delivery temperature is given. Coolers are
 * taken without pressure drop. Source: Y. A. Çengel and M. A. Boles, Thermodynamics: An
 * Engineering Approach (McGraw-Hill), ch. 7, "isentropic efficiency of compressors" and
 * "multistage compression with intercooling", where equal pressure ratios minimise the work
 * of ideal intercooled stages; the entropy of an ideal gas with variable c_p, s°(T2) − s°(T1)
 * − R ln(p2/p1), ibid. ch. 7. With constant c_p the same steps reduce to the textbook formula
 *   w = [γ/(γ − 1)] R T_k (r^((γ−1)/γ) − 1) / η_s,
 * which the tests compare (within 0.3 % for hydrogen, whose c_p barely changes up to 550 K).
 * The work is the gas's: mechanical and drive losses are not included.
 */
import { GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { mixtureEnthalpyJ, mixtureHeatCapacityJPerK, mixtureMolarMassKgPerMol, mixtureStandardEntropyJPerK } from '../thermo/mixture.ts';
import { temperatureAtEnthalpyK, temperatureAtStandardEntropyK } from '../thermo/mixture-temperature.ts';
import { FlowsheetInputError } from './input-error.ts';

export interface CompressionRequest {
  /** Gas composition, species label → amount or mole fraction (only the ratios matter). */
  composition: Readonly<Record<string, number>>;
  molarFlowMolPerS: number;
  inletTemperatureK: number;
  inletPressureBar: number;
  deliveryPressureBar: number;
  /** Number of stages, a whole number ≥ 1; each has the pressure ratio (p_out/p_in)^(1/N). */
  stages: number;
  /** Isentropic efficiency of each stage, in (0, 1]. */
  isentropicEfficiency: number;
  /** Temperature the intercoolers cool the gas to before stages 2..N, K. */
  intercoolTemperatureK: number;
  /** When given, an after-cooler cools the delivered gas to this temperature, K. */
  deliveryTemperatureK?: number;
}

export interface CompressionStage {
  inletTemperatureK: number;
  inletPressureBar: number;
  outletPressureBar: number;
  isentropicOutletTemperatureK: number;
  outletTemperatureK: number;
  /** Work per mol of gas, J/mol: isentropic, and actual (isentropic / η_s). */
  isentropicWorkJPerMol: number;
  workJPerMol: number;
  /** Power given to the gas in this stage, W. */
  powerW: number;
  /** Heat removed by the cooler after this stage (intercooler, or after-cooler after the last), W; 0 without one. */
  coolerDutyW: number;
  /** Temperature the cooler after this stage leaves, K; null without one. */
  cooledToK: number | null;
}

export interface Compression {
  pressureRatioPerStage: number;
  stages: CompressionStage[];
  /** Σ stage powers: the power given to the gas, W (mechanical and drive losses not included). */
  powerW: number;
  workJPerMol: number;
  workJPerKg: number;
  /** Heat removed between stages, W. */
  intercoolerDutyW: number;
  /** Heat removed after the last stage, W (0 without an after-cooler). */
  aftercoolerDutyW: number;
  /** Temperature of the gas delivered (after the after-cooler if any), K. */
  deliveryTemperatureK: number;
}

/** Checks the request; each message names the field it concerns. */
function validate(request: CompressionRequest): void {
  const positive = (field: keyof CompressionRequest, value: number, unit: string) => {
    if (!(value > 0) || !Number.isFinite(value)) throw new FlowsheetInputError(field, `must be a positive number of ${unit}, got ${value}`);
  };
  positive('inletTemperatureK', request.inletTemperatureK, 'K');
  positive('intercoolTemperatureK', request.intercoolTemperatureK, 'K');
  positive('inletPressureBar', request.inletPressureBar, 'bar');
  positive('deliveryPressureBar', request.deliveryPressureBar, 'bar');
  if (request.deliveryTemperatureK !== undefined) positive('deliveryTemperatureK', request.deliveryTemperatureK, 'K');
  if (!(request.molarFlowMolPerS >= 0) || !Number.isFinite(request.molarFlowMolPerS)) {
    throw new FlowsheetInputError('molarFlowMolPerS', `must be a non-negative number of mol/s, got ${request.molarFlowMolPerS}`);
  }
  if (!(request.deliveryPressureBar > request.inletPressureBar)) {
    throw new FlowsheetInputError('deliveryPressureBar', `must be above the inlet pressure (${request.inletPressureBar} bar) for a compressor, got ${request.deliveryPressureBar} bar`);
  }
  if (!Number.isInteger(request.stages) || request.stages < 1) throw new FlowsheetInputError('stages', `must be a whole number of at least 1, got ${request.stages}`);
  if (!(request.isentropicEfficiency > 0 && request.isentropicEfficiency <= 1)) {
    throw new FlowsheetInputError('isentropicEfficiency', `must lie in (0, 1], got ${request.isentropicEfficiency}`);
  }
  const total = Object.values(request.composition).reduce((s, v) => s + v, 0);
  if (!(total > 0) || Object.values(request.composition).some((v) => !(v >= 0))) {
    throw new FlowsheetInputError('composition', 'must give non-negative amounts with a positive total');
  }
}

/** The gas's composition as mole fractions (Σ y = 1), so that its properties are per mol of gas. */
function moleFractions(composition: Readonly<Record<string, number>>): Record<string, number> {
  const total = Object.values(composition).reduce((s, v) => s + v, 0);
  return Object.fromEntries(Object.entries(composition).map(([k, v]) => [k, v / total]));
}

/** One adiabatic stage from (T_in, p_in) by the pressure ratio r: the module comment's equations. */
function stage(y: Record<string, number>, inletTemperatureK: number, ratio: number, efficiency: number) {
  const entropyOut = mixtureStandardEntropyJPerK(y, inletTemperatureK) + R * Math.log(ratio);
  // Start from the constant-c_p isentropic relation T_s = T_in r^(R/c_p(T_in)).
  const guessK = inletTemperatureK * ratio ** (R / mixtureHeatCapacityJPerK(y, inletTemperatureK));
  const isentropicOutletTemperatureK = temperatureAtStandardEntropyK(y, entropyOut, guessK);
  const hIn = mixtureEnthalpyJ(y, inletTemperatureK);
  const isentropicWorkJPerMol = mixtureEnthalpyJ(y, isentropicOutletTemperatureK) - hIn;
  const workJPerMol = isentropicWorkJPerMol / efficiency;
  const outletTemperatureK = temperatureAtEnthalpyK(y, hIn + workJPerMol, isentropicOutletTemperatureK);
  return { isentropicOutletTemperatureK, isentropicWorkJPerMol, workJPerMol, outletTemperatureK };
}

/** N-stage intercooled compression (the module comment's equations). */
export function compressGas(request: CompressionRequest): Compression {
  validate(request);
  const y = moleFractions(request.composition);
  const flow = request.molarFlowMolPerS;
  const n = request.stages;
  const ratio = (request.deliveryPressureBar / request.inletPressureBar) ** (1 / n);
  const stages: CompressionStage[] = [];
  let temperatureK = request.inletTemperatureK;
  let pressureBar = request.inletPressureBar;
  for (let k = 0; k < n; k++) {
    const last = k === n - 1;
    const outletPressureBar = last ? request.deliveryPressureBar : pressureBar * ratio;
    const s = stage(y, temperatureK, ratio, request.isentropicEfficiency);
    const cooledToK = last ? (request.deliveryTemperatureK ?? null) : request.intercoolTemperatureK;
    const coolerDutyW = cooledToK === null ? 0 : flow * (mixtureEnthalpyJ(y, s.outletTemperatureK) - mixtureEnthalpyJ(y, cooledToK));
    stages.push({ inletTemperatureK: temperatureK, inletPressureBar: pressureBar, outletPressureBar, ...s, powerW: flow * s.workJPerMol, coolerDutyW, cooledToK });
    temperatureK = cooledToK ?? s.outletTemperatureK;
    pressureBar = outletPressureBar;
  }
  const workJPerMol = stages.reduce((w, s) => w + s.workJPerMol, 0);
  return {
    pressureRatioPerStage: ratio,
    stages,
    powerW: stages.reduce((p, s) => p + s.powerW, 0),
    workJPerMol,
    workJPerKg: workJPerMol / mixtureMolarMassKgPerMol(y),
    intercoolerDutyW: stages.slice(0, -1).reduce((q, s) => q + s.coolerDutyW, 0),
    aftercoolerDutyW: stages[n - 1]!.coolerDutyW,
    deliveryTemperatureK: temperatureK,
  };
}
