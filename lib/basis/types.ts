/**
 * The validated design basis: what lib/basis hands to the calculation, everything in SI
 * (K, bar absolute, A/m2, ohm m2, m2, W, V, kg/s, mole fractions). The YAML a user writes
 * (projects/<id>/basis.yaml, documented in lib/basis/schema.ts and the JSON Schema) is
 * parsed, checked and converted into this shape; the calculation never sees unit strings.
 */
import type { Mode, TechnologyId } from '../electrochem/technologies.ts';

export interface Signatory {
  name: string;
  /** ISO date, YYYY-MM-DD. */
  date?: string;
}

/**
 * Document control as the basis states it. The revision and its status are not here: the issued
 * revisions (lib/archive) decide them, and the working basis is always the draft of the next one.
 */
export interface DocumentInfo {
  title: string;
  number: string;
  client: string;
  site: string;
  paper: 'A4' | 'Letter';
  purpose: string;
  scope: string;
  signOff: { prepared?: Signatory; checked?: Signatory; approved?: Signatory };
}

export interface CellInfo {
  technology: TechnologyId;
  mode: Mode;
  fuelElectrode?: string;
  airElectrode?: string;
  electrolyte?: string;
  /** Whether the fuel electrode (or a reformer catalyst named in the basis) contains nickel. */
  nickelBearing: boolean;
  /** How nickelBearing was decided: stated in the basis, or read from the material text. */
  nickelBearingFrom: 'stated' | 'material text' | 'default';
  /** Ionic transference number t_ion in (0, 1]; the open-circuit voltage is t_ion × E_Nernst. 1 when not given. */
  ionicTransferenceNumber: number;
  /** Voltage allowance for gas crossover and internal leakage subtracted from the open-circuit voltage, V. 0 when not given. */
  crossoverAllowanceV: number;
  /** Mass fraction of KOH in the electrolyte of an alkaline cell (0.30 for 30 wt %); absent for the other technologies. */
  kohMassFraction?: number;
}

export interface Conditions {
  /** Stack operating temperature (cell temperature, isothermal model), K. */
  temperatureK: number;
  /** Temperature range for the sweep charts, K. */
  sweepFromK: number;
  sweepToK: number;
  /** Fuel-electrode and air-electrode feed temperatures at the stack inlet, K (default: operating temperature). */
  fuelInletTemperatureK: number;
  airInletTemperatureK: number;
  /** Allowed temperature rise of the air through the stack, for the cooling-air estimate, K. */
  allowedAirTemperatureRiseK: number;
  /** Absolute pressures of the fuel-electrode and air-electrode gas, bar. */
  fuelPressureBar: number;
  airPressureBar: number;
  /** Cold-sink temperature for the Carnot comparison, K (default 298.15 K). */
  ambientTemperatureK: number;
}

/**
 * The pre-reformer ahead of the stack: none; at equilibrium at a given outlet temperature (its
 * feed heated to that temperature, the reactor heated or cooled to hold it: a duty); or
 * adiabatic, its feed entering at a given temperature and the outlet temperature solved.
 */
export type PreReforming = { kind: 'none' } | { kind: 'equilibrium'; temperatureK: number } | { kind: 'adiabatic'; inletTemperatureK: number };

export interface FuelStream {
  /** Mixture name if the composition came from a preset or a named mixture of the basis. */
  compositionName?: string;
  /** Dry fuel (or feed) composition before steam is added, mole fractions summing to 1. */
  composition: Record<string, number>;
  /**
   * Steam-to-carbon ratio, if given: mol of H2O added per mol of combustible carbon in the dry
   * fuel (carbon of hydrocarbons, alcohols and CO; carbon of CO2 excluded), the reformer convention.
   */
  steamToCarbon?: number;
  /** Steam added per mole of the dry fuel, if given instead of steamToCarbon. */
  steamPerMoleFuel?: number;
  preReforming: PreReforming;
  /** The feed entering the stack (or the pre-reformer) after steam addition, mole fractions summing to 1. */
  feed: Record<string, number>;
}

export interface AirStream {
  compositionName?: string;
  /** Mole fractions summing to 1 (humid air includes its H2O). */
  composition: Record<string, number>;
  /** Humidity as stated and as converted (humid-air only); the composition already includes it. */
  humidity?: AirHumidity;
  /**
   * A carbonate cell's cathode-gas loop (streams.air-electrode.cathode-loop): the composition above
   * (and its humidity) is then the burner air's, and the air-electrode feed is computed (lib/plant/cathode-loop.ts).
   */
  cathodeLoop?: { inletOxygenFraction: number };
}

/**
 * The humidity of humid air as stated and what it was converted with (lib/basis/humid-air.ts):
 * x_H2O = φ · p_sat(T) / p, by Dalton's law for an ideal gas, p_sat from the IAPWS-IF97
 * saturation line (region 4, IAPWS R7-97). A dew point is the air fed to the electrode, saturated
 * at T = T_d (φ = 1), at the air-electrode pressure; a relative humidity is the ambient air's, at
 * the ambient pressure.
 */
export interface AirHumidity {
  form: 'dew-point' | 'relative-humidity';
  /** The dew point, or the temperature at which the relative humidity is stated. */
  temperatureK: number;
  /** φ as stated, a fraction; null for a dew point (saturated there). */
  relativeHumidity: number | null;
  /** p_sat(temperatureK), IAPWS-IF97 region 4. */
  saturationPressurePa: number;
  /** The pressure p the humidity is converted at. */
  pressurePa: number;
  /** Which pressure p is: the air electrode's (a dew point) or the ambient (a relative humidity). */
  pressureOf: 'air-electrode' | 'ambient';
  /** x_H2O of the air fed. */
  waterFraction: number;
}

export type AirSupply =
  | { kind: 'utilization'; value: number }
  | { kind: 'ratio'; value: number }
  /** Electrolysis: sweep-gas moles per mole of O2 produced. */
  | { kind: 'sweep-ratio'; value: number }
  /** Electrolysis without sweep gas: pure oxygen leaves the air electrode. */
  | { kind: 'none' };

export type VoltageModel = { kind: 'given'; cellVoltageV: number } | { kind: 'area-specific-resistance'; ohmM2: number };

/**
 * Arrhenius law of the area-specific resistance: ASR(T) = ASR(T_ref) exp[(E_a/R)(1/T − 1/T_ref)].
 * T_ref absent: the operating temperature (always so when the basis gives the cell voltage).
 */
export interface ResistanceLaw {
  activationEnergyJPerMol: number;
  referenceTemperatureK?: number;
  source: string;
}

/**
 * The activation (kinetic) loss of the cell's electrodes, lumped into one symmetric Butler–Volmer
 * term at the current density i referred to the geometric area:
 *   η_act(i) = (b / ln 10) · asinh(i / (2 i₀))
 * b the Tafel slope (V per decade of current density), i₀ the exchange current density. Both are
 * taken as given at every temperature of the basis (no temperature law).
 */
export interface ActivationLoss {
  /** b, volts per decade of current density. */
  tafelSlopeVPerDecade: number;
  /** i₀, A/m² of geometric area. */
  exchangeCurrentDensityAPerM2: number;
  source: string;
}

/** What a degradation rate applies to. */
export const DEGRADED_QUANTITIES = ['cell-voltage', 'area-specific-resistance'] as const;

export type DegradedQuantity = (typeof DEGRADED_QUANTITIES)[number];

/**
 * Degradation over operating time at a constant rate r (linear; common practice, no source):
 * area-specific-resistance: ASR(t) = ASR₀ (1 + r t); cell-voltage: at the same current density
 * V(t) = V₀ (1 − r t) in power mode, V₀ (1 + r t) in electrolysis. The voltage or resistance the
 * basis gives is the beginning-of-life value V₀ or ASR₀.
 */
export interface Degradation {
  of: DegradedQuantity;
  /** r, per second of operation (SI; "0.5 %/kh" is 0.005 per 3.6e6 s). */
  ratePerS: number;
  /** t, seconds of operation. */
  operatingTimeS: number;
}

export type StackSize =
  | { kind: 'cells'; cells: number }
  /** Target stack power: net electric output (power mode) or electric input (electrolysis), W. */
  | { kind: 'power'; powerW: number }
  /** Electrolysis: target hydrogen production, kg/s. */
  | { kind: 'hydrogen'; kgPerS: number };

export interface OperatingPoint {
  /** Fuel utilization (power) or steam conversion (electrolysis), in (0, 1). */
  utilization: number;
  air: AirSupply;
  currentDensityAPerM2: number;
  voltage: VoltageModel;
  /** How the area-specific resistance changes with temperature; absent: held constant. */
  resistanceLaw?: ResistanceLaw;
  /** The activation loss of the electrodes; absent: none (the ohmic cell). */
  activationLoss?: ActivationLoss;
  /** Degradation at an operating time; absent: beginning of life. */
  degradation?: Degradation;
  activeAreaM2: number;
  size: StackSize;
  /** When both a cell count and a target were given (and agree within 2 %), the cell count. */
  statedCells?: number;
  /** Fraction of the stack DC power the balance of plant draws (from the AC side), in [0, 1). */
  parasiticFraction: number;
  /** Efficiency of the power conversion between the stack's DC and the plant's AC (inverter or rectifier), in (0, 1]; 1 when not given. */
  conversionEfficiency: number;
}

/** How the stacks are connected (plant.electrical); what is not given is derived. */
export interface ElectricalInput {
  cellsPerStack?: number;
  stacksInSeries?: number;
  /** DC bus voltage window from which the stacks in series are derived, V. */
  busVoltageWindowV?: { minV: number; maxV: number };
  stringsInParallel?: number;
}

/** What burns the fuel-electrode off-gas: the air-electrode exhaust, or fresh air at a ratio to the oxygen complete combustion needs. */
export type OffGasOxidant = { kind: 'air-electrode-exhaust' } | { kind: 'fresh-air'; airRatio: number };

/** Hydrogen compression after the product cooler and dryer (electrolysis). */
export interface CompressionInput {
  deliveryPressureBar: number;
  /**
   * The stages: given, or the fewest that keep each stage's pressure ratio at or below
   * maximumStageRatio (where stated) and each stage's discharge at or below
   * maximumDischargeTemperatureK (where stated), from the stack's pressure, per case.
   */
  stages: { given: number } | { maximumStageRatio: number | null };
  /** The highest temperature a stage may discharge the gas at, K: a rule for the stages, or a check on the stages given; null where not stated. */
  maximumDischargeTemperatureK: number | null;
  isentropicEfficiency: number;
  /** Temperature the product gas is cooled to ahead of the first stage, and between stages, K. */
  inletTemperatureK: number;
  intercoolTemperatureK: number;
}

/** The plant around the stack (the `plant:` section), SI, defaults filled in. */
export interface PlantInput {
  electrical: ElectricalInput;
  /** Temperatures at which fuel, air and feed water reach the plant, K (default: the ambient temperature). */
  fuelSupplyTemperatureK: number;
  airSupplyTemperatureK: number;
  feedWaterTemperatureK: number;
  /** Power mode, cells that reform at the fuel electrode: share of the fuel-electrode off-gas returned to the fuel inlet. */
  anodeRecycle: { ratio: number; tolerance: number } | null;
  offGasOxidiser: { oxidant: OffGasOxidant; materialLimitK: number } | null;
  /** Power mode: the exhaust cooled to this temperature, the heat used by the plant's heaters first and the rest delivered. */
  heatRecovery: { exhaustExitTemperatureK: number; stackHeat: 'recovered' | 'rejected'; minimumApproachK: number } | null;
  /** Power mode: the blower that raises the air from its inlet pressure to the air-electrode pressure; null when not given. */
  airBlower: { isentropicEfficiency: number; inletPressureBar: number } | null;
  /** Heat lost to ambient, as a fraction of the fuel's LHV input (power) or of the stack's DC input (electrolysis). */
  heatLossFraction: number;
  /** Electrolysis: where the heat of the feed heaters and of the stack below thermoneutral comes from. */
  heatSupply: 'electric' | 'external';
  hydrogenCompression: CompressionInput | null;
  /** Electrolysis fed with steam: the stack's hot gas outlets heat the gaseous feeds in a counter-flow recuperator with this least approach, K. */
  recuperator: { minimumApproachK: number } | null;
}

export interface Sensitivity {
  temperatureK: number;
  /** Relative change of both electrode pressures. */
  pressureFraction: number;
  /** Absolute change of fuel utilization or steam conversion. */
  utilization: number;
  /** Absolute change of steam-to-carbon ratio (ignored when the fuel has no carbon). */
  steamToCarbon: number;
  /** Relative change of current density. */
  currentDensityFraction: number;
}

/** An open assumption accepted for an approved revision: why it may stay open, who accepted it and when. */
export interface Acceptance {
  reason: string;
  by: string;
  /** ISO date, YYYY-MM-DD. */
  date: string;
}

export interface Assumption {
  id: string;
  text: string;
  /** Needs later verification: reported as an open item. */
  open: boolean;
  reference?: string;
  /** Basis fields (dotted paths, or sections) whose values and results the assumption vouches for. */
  concerns: string[];
  /** Only for an open assumption: accepted as open, so that a revision may be approved with it. */
  accepted?: Acceptance;
}

export interface Reference {
  id: string;
  citation: string;
}

/** One design input as the engineer wrote it, for the design-inputs table and revision comparison. */
export interface InputRecord {
  /** YAML field path, e.g. "conditions.operating-temperature". */
  path: string;
  /** Human label, e.g. "operating temperature". */
  label: string;
  /** The value as written, e.g. "800 C" or "0.85". */
  text: string;
  /** The unit as written ("" for dimensionless). */
  unit: string;
  /** SI value, with its SI unit. */
  si: number;
  siUnit: string;
  /** Reference id or justification given with the value. */
  source?: string;
  /** Where the value stands in the basis file (1-based). */
  line?: number;
  column?: number;
}

export interface Diagnostic {
  severity: 'error' | 'warning';
  file: string;
  line: number;
  column: number;
  /** Dotted field path, e.g. "conditions.operating-temperature"; "" for the whole file. */
  path: string;
  message: string;
}

/** How a case states its load on the hardware of the sizing case. */
export type CaseLoad =
  /** The sizing case: its load and size as any basis states them (cells, or a target met at its current density). */
  | 'sizing'
  /** Its own current density (given by the case, or the base current density when the case states no load). */
  | 'current-density'
  /** A target net (power mode) or input (electrolysis) power, met by solving for the current density. */
  | 'target-power'
  /** A target hydrogen production (electrolysis), met by solving for the current density. */
  | 'target-hydrogen';

/**
 * An operating case (`cases:` of the basis): the base basis with the overrides of the case. The
 * sizing case fixes the hardware; every other case runs on it at its own load.
 */
export interface OperatingCase {
  /** Its key under `cases:`, e.g. end-of-life; "base" for the base values when no case is marked sizing. */
  id: string;
  title: string;
  purpose: string;
  sizing: boolean;
  load: CaseLoad;
  /** Each value the case overrides, as written (path as in the base basis), with its source and position in the file. */
  overrides: CaseOverride[];
  /** Dotted paths of the keys the case overrides (the base paths: operating-point.target-power), values and non-scalar keys alike. */
  overridden: string[];
  /** The base basis with the case's overrides, validated as a basis of its own (it has no cases). */
  basis: CaseBasis;
}

/** One value a case overrides, as written. */
export interface CaseOverride {
  /** The base path of the value, dotted: operating-point.degradation.rate, streams.fuel-electrode.composition. */
  path: string;
  /** Its label in the inputs table where it is a number with a unit, else its keys in words. */
  label: string;
  /** As written: "0.5 %/kh", "cell-voltage", "40000 h". */
  text: string;
  source?: string;
  /** Where the value stands in the file (1-based). */
  line: number;
  column: number;
  /** The value in SI with its unit, where it is a number with a unit (the inputs-table record). */
  input?: InputRecord;
}

/** The basis of one case: a design basis of its own, whose `cases` are []. */
export type CaseBasis = DesignBasis;

export interface DesignBasis {
  /** Project id (the folder name under projects/). */
  id: string;
  /** Path of the basis file as given to the loader. */
  file: string;
  document: DocumentInfo;
  cell: CellInfo;
  conditions: Conditions;
  /**
   * Feed of the fuel electrode: the fuel (power mode); steam with some H2, or steam and CO2 for
   * co-electrolysis (solid-oxide electrolysis). Null where that electrode has no feed
   * (electrolysis in proton-conducting, PEM and alkaline cells, whose water is on the other side
   * or in the electrolyte).
   */
  fuelElectrode: FuelStream | null;
  /**
   * Feed of the air (oxygen) electrode: air or oxygen (power mode); sweep air (solid-oxide
   * electrolysis), steam (proton-ceramic electrolysis) or liquid water, {"H2O(L)": 1} (PEM
   * electrolysis). Null for electrolysis without sweep gas and for alkaline electrolysis.
   */
  airElectrode: AirStream | null;
  operatingPoint: OperatingPoint;
  /** The plant around the stack (the `plant:` section, defaults where it is absent). */
  plant: PlantInput;
  sensitivity: Sensitivity;
  assumptions: Assumption[];
  references: Reference[];
  inputs: InputRecord[];
  warnings: Diagnostic[];
  /**
   * Position (1-based line and column) of every value in the file by dotted path
   * ("operating-point.cells", "streams.fuel-electrode.composition"), for errors the
   * calculation finds in a basis that passed validation.
   */
  positions: Record<string, { line: number; column: number }>;
  /**
   * The operating cases in the order written, the sizing case among them ([] when the basis
   * defines none). When no case is marked sizing the base values are the sizing case, listed
   * first with the id "base".
   */
  cases: OperatingCase[];
}
