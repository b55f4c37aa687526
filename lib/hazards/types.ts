/**
 * The shapes of the hazards library: what the plant calculation hands to `assessHazards`
 * (HazardInput, one HazardStream per stream of the flowsheet) and the JSON-serialisable
 * assessment it returns (units in the key names: `temperature_K`, `lfl_percent`,
 * `coConcentration_ppm`). Percent values of streams are mole percent, which for ideal gases is
 * the volume percent the flammability limits are stated in.
 */
import type { Mode, TechnologyId } from '../electrochem/technologies.ts';

/**
 * What a stream is, for the rules that depend on it: `feed` enters the plant, `internal` stays
 * inside it (pre-reformer outlet, recycle), `outlet` leaves the stack to be disposed of (anode
 * off-gas, cathode exhaust, purge), `product` is delivered (hydrogen or oxygen product).
 */
export type StreamRole = 'feed' | 'internal' | 'outlet' | 'product';

export const STREAM_ROLES: readonly StreamRole[] = ['feed', 'internal', 'outlet', 'product'];

/** The fuel-electrode (and reformer) side or the air-electrode side of the plant. */
export type StreamSide = 'fuel' | 'air';

export const STREAM_SIDES: readonly StreamSide[] = ['fuel', 'air'];

export interface HazardStream {
  id: string;
  name: string;
  temperatureK: number;
  /** Absolute pressure, bar. */
  pressureBar: number;
  /** Mole fractions by species label as in lib/thermo (aliases accepted), summing to 1. */
  moleFractions: Record<string, number>;
  /** What the stream is; when omitted it is treated as an outlet (the rules then err towards cautioning). */
  role?: StreamRole;
  /** Which electrode's gas it is; when omitted, the rules that depend on it treat it as fuel side. */
  side?: StreamSide;
}

export interface HazardInput {
  /** Fuel inlet, pre-reformer outlet, anode outlet, cathode outlet, hydrogen product, oxygen product, recycles and purges. */
  streams: HazardStream[];
  technology: TechnologyId;
  mode: Mode;
  /** Whether the fuel electrode or a reformer catalyst contains nickel. */
  nickelBearing: boolean;
  operatingTemperatureK: number;
  /** Absolute pressures of the fuel-electrode and air-electrode gas, bar. */
  fuelPressureBar: number;
  airPressureBar: number;
  ambientTemperatureK: number;
}

export type Severity = 'danger' | 'warning' | 'caution';

export const SEVERITIES: readonly Severity[] = ['danger', 'warning', 'caution'];

/** A published value with its source: a short name for texts and the full citation. */
export interface SourcedValue<T = number> {
  value: T;
  source: string;
  citation: string;
  /** Quoted from memory of the publication, not re-read from it. */
  memory: boolean;
}

export interface SpeciesShare {
  species: string;
  mole_percent: number;
}

/** Mixture flammability of a stream by Le Chatelier's rule (lib/hazards/flammability.ts). */
export interface StreamFlammability {
  /** Lower and upper flammable limits of the combustible-only mixture in air, vol %. */
  lfl_percent: number;
  /** Null where a combustible has no recorded upper limit. */
  ufl_percent: number | null;
  /** Lower limit of the stream as a whole (inerts included) in air: vol % of this gas in air. */
  streamLfl_percent: number;
  /** Lowest limiting oxygen concentration of the combustibles, vol % O2, and the species it comes from. */
  limitingOxygen_percent: number;
  limitingOxygenSpecies: string;
  /** Whether limitingOxygen_percent is the z × LFL estimate rather than a recorded value. */
  limitingOxygenEstimated: boolean;
  /** Detector alarm at the code-practice fraction of the LFL: vol % combustibles in air, and vol % of this gas in air. */
  detectorAlarm_percent: number;
  detectorAlarmStream_percent: number;
}

export type InsideRangeFinding =
  | 'no combustibles'
  | 'no oxidant'
  | 'too lean'
  | 'below limiting oxygen'
  | 'too rich'
  | 'inside'
  | 'inside (oxygen-enriched: upper limit not applied)'
  | 'inside (no upper limit recorded)';

export interface ExposureIndicator {
  species: string;
  concentration_ppm: number;
  idlh_ppm: number | null;
  /** concentration / IDLH: the dilution a leak needs before a room is no longer immediately dangerous. */
  timesIdlh: number | null;
}

export interface CarbonMonoxideIndicator {
  coConcentration_ppm: number;
  idlh_ppm: number;
  timesIdlh: number;
  nioshRelTwa_ppm: number;
  nioshRelCeiling_ppm: number;
  oshaPelTwa_ppm: number;
}

export interface AutoignitionIndicator {
  /** Lowest recorded autoignition temperature of the combustibles present. */
  lowest_K: number;
  lowest_C: number;
  species: string;
  /** Short name and full citation of the source of that value. */
  source: string;
  citation: string;
  /** Stream temperature at or above it. */
  streamAbove: boolean;
  /** Operating temperature at or above it. */
  operatingAbove: boolean;
}

export interface StreamIndicators {
  id: string;
  name: string;
  role: StreamRole;
  /** True where the role was not given and `outlet` was assumed. */
  roleAssumed: boolean;
  side: StreamSide | 'not given';
  temperature_K: number;
  temperature_C: number;
  pressure_bar: number;
  /** Gas-phase composition, species present (at or above the presence threshold), largest first. */
  composition: SpeciesShare[];
  /** Condensed species left out of the gas phase. */
  condensedExcluded: string[];
  combustibles: SpeciesShare[];
  combustible_percent: number;
  oxygen_percent: number;
  /** Null where the stream has no combustibles. */
  flammability: StreamFlammability | null;
  flammableOnMixingWithAir: boolean;
  insideFlammableRange: boolean;
  insideFlammableRangeFinding: InsideRangeFinding;
  /** Null where the stream carries no CO (below the presence threshold). */
  carbonMonoxide: CarbonMonoxideIndicator | null;
  /** Every present species with an exposure limit, CO included. */
  exposure: ExposureIndicator[];
  hydrogenPartialPressure_bar: number;
  /** Null where the stream has no combustible with a recorded autoignition temperature. */
  autoignition: AutoignitionIndicator | null;
  /** Present species with no hazard entry (flammability and toxicity not assessed). */
  unassessed: SpeciesShare[];
}

export interface StandardRef {
  id: string;
  number: string;
  title: string;
}

export interface Caution {
  id: string;
  title: string;
  severity: Severity;
  text: string;
  standards: StandardRef[];
  /** Ids of the streams that triggered the caution; empty where the basis itself did. */
  triggeredBy: string[];
}

export type ExposureLimit =
  | 'oshaPelTwa'
  | 'oshaPelCeiling'
  | 'oshaPelPeak'
  | 'nioshRelTwa'
  | 'nioshRelStel'
  | 'nioshRelCeiling'
  | 'idlh'
  | 'acgihTlvTwa'
  | 'acgihTlvStel';

/** A pair of published limits in air (or in oxygen), vol %. */
export interface LimitPair {
  lfl_percent: number;
  ufl_percent: number | null;
  source: string;
  citation: string;
  memory: boolean;
}

/** The hazard data of one substance (lib/hazards/data/substances.yaml), sources resolved. */
export interface SubstanceData {
  /** Species label as in lib/thermo (or the hazard-only label, Ni(CO)4). */
  species: string;
  /** Short key for text templates: `{h2.lfl}`, `{co.idlh}`. */
  key: string;
  name: string;
  cas: string;
  /** Not a species of the thermodynamic data: named only where conditions can form it. */
  formsOnly: boolean;
  oxidant: boolean;
  /** Has a lower flammable limit in air: burns. */
  combustible: boolean;
  lfl_percent: SourcedValue | null;
  ufl_percent: SourcedValue | null;
  /** Other published limits, for information (not used in calculations). */
  alsoPublished: LimitPair[];
  inOxygen: LimitPair | null;
  autoignition_C: SourcedValue[];
  /** The lowest of autoignition_C, the one the indicators use; null where none is recorded. */
  lowestAutoignition_C: SourcedValue | null;
  minimumIgnitionEnergy_mJ: SourcedValue[];
  limitingOxygen_percent: SourcedValue | null;
  gasGroup: SourcedValue<string> | null;
  temperatureClass: SourcedValue<string> | null;
  exposure_ppm: Partial<Record<ExposureLimit, SourcedValue>>;
  carcinogen: SourcedValue<string> | null;
  /** Oxygen only: its share of dry air and the share above which gas counts as oxygen-enriched, vol %. */
  inAir_percent: SourcedValue | null;
  enrichedAbove_percent: SourcedValue | null;
  notes: SourcedValue<string>[];
}

export interface SubstanceRow extends SubstanceData {
  /** In a stream of the basis, or named because the basis's conditions can form it. */
  presence: 'in streams' | 'can form';
}

export interface MethodNote {
  id: string;
  text: string;
}

export interface HazardAssessment {
  notice: string;
  basis: {
    technology: TechnologyId;
    technologyName: string;
    mode: Mode;
    nickelBearing: boolean;
    operatingTemperature_K: number;
    fuelPressure_bar: number;
    airPressure_bar: number;
    ambientTemperature_K: number;
  };
  substances: SubstanceRow[];
  streams: StreamIndicators[];
  /** Sorted by severity (danger first), then in the order of the rule table. */
  cautions: Caution[];
  method: MethodNote[];
}
