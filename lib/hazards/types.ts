/**
 * The shapes of the hazards library: what the plant calculation hands to `assessHazards`
 * (HazardInput, one HazardStream per stream of the flowsheet) and the JSON-serialisable
 * assessment it returns (units in the key names: `temperature_K`, `lfl_percent`,
 * `coConcentration_ppm`). Percent values of streams are mole percent, which for ideal gases is
 * the volume percent the flammability limits are stated in. The assessment is defined once, as
 * the zod schema `hazardAssessmentSchema`: its TypeScript types are inferred from it, and the
 * results schema (lib/plant/results-schema.ts) carries it, so results.json is typed and checked
 * down to every hazard value.
 */
import { z } from 'zod';
import { MODES, TECHNOLOGY_IDS, type Mode, type TechnologyId } from '../electrochem/technologies.ts';

/**
 * What a stream is, for the rules that depend on it: `feed` enters the plant, `internal` stays
 * inside it (pre-reformer outlet, recycle), `outlet` leaves the stack to be disposed of (anode
 * off-gas, cathode exhaust, purge), `product` is delivered (hydrogen or oxygen product).
 */
export type StreamRole = 'feed' | 'internal' | 'outlet' | 'product';

export const STREAM_ROLES = ['feed', 'internal', 'outlet', 'product'] as const satisfies readonly StreamRole[];

/** The fuel-electrode (and reformer) side or the air-electrode side of the plant. */
export type StreamSide = 'fuel' | 'air';

export const STREAM_SIDES = ['fuel', 'air'] as const satisfies readonly StreamSide[];

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
  /**
   * The DC voltage the electrical caution reads, V, and what it is, as the caution names it: the
   * plant hands it the highest DC bus voltage of the electrical layout (lib/plant/hazard-streams.ts).
   */
  dcVoltage: { voltageV: number; description: string };
}

export const SEVERITIES = ['danger', 'warning', 'caution'] as const;

export type Severity = (typeof SEVERITIES)[number];

/** A published value with its source: a short name for texts and the full citation. */
export interface SourcedValue<T = number> {
  value: T;
  source: string;
  citation: string;
  /** Quoted from memory of the publication, not re-read from it. */
  memory: boolean;
}

function sourcedSchema<T extends z.ZodType>(value: T) {
  return z.object({
    value,
    source: z.string().describe('short name of the source, for texts'),
    citation: z.string().describe('full citation of the source'),
    memory: z.boolean().describe('quoted from memory of the publication, not re-read from it'),
  });
}

const sourcedNumber = sourcedSchema(z.number());
const sourcedText = sourcedSchema(z.string());

const speciesShareSchema = z.object({ species: z.string(), mole_percent: z.number() });

export type SpeciesShare = z.infer<typeof speciesShareSchema>;

/** Mixture flammability of a stream by Le Chatelier's rule (lib/hazards/flammability.ts). */
const streamFlammabilitySchema = z.object({
  lfl_percent: z.number().describe('lower flammable limit of the combustible-only mixture in air, vol %'),
  ufl_percent: z.number().nullable().describe('upper flammable limit of the combustible-only mixture in air, vol %; null where a combustible has no recorded upper limit'),
  streamLfl_percent: z.number().describe('lower limit of the stream as a whole (inerts included) in air: vol % of this gas in air'),
  limitingOxygen_percent: z.number().describe('lowest limiting oxygen concentration of the combustibles, vol % O2'),
  limitingOxygenSpecies: z.string().describe('the species it comes from'),
  limitingOxygenEstimated: z.boolean().describe('whether limitingOxygen_percent is the z × LFL estimate rather than a recorded value'),
  detectorAlarm_percent: z.number().describe('detector alarm at the code-practice fraction of the LFL: vol % combustibles in air'),
  detectorAlarmStream_percent: z.number().describe('the same as vol % of this gas in air'),
});

export type StreamFlammability = z.infer<typeof streamFlammabilitySchema>;

const INSIDE_RANGE_FINDINGS = [
  'no combustibles',
  'no oxidant',
  'too lean',
  'below limiting oxygen',
  'too rich',
  'inside',
  'inside (oxygen-enriched: upper limit not applied)',
  'inside (no upper limit recorded)',
] as const;

export type InsideRangeFinding = (typeof INSIDE_RANGE_FINDINGS)[number];

const exposureIndicatorSchema = z.object({
  species: z.string(),
  concentration_ppm: z.number(),
  idlh_ppm: z.number().nullable(),
  timesIdlh: z.number().nullable().describe('concentration / IDLH: the dilution a leak needs before a room is no longer immediately dangerous'),
});

export type ExposureIndicator = z.infer<typeof exposureIndicatorSchema>;

const carbonMonoxideIndicatorSchema = z.object({
  coConcentration_ppm: z.number(),
  idlh_ppm: z.number(),
  timesIdlh: z.number(),
  nioshRelTwa_ppm: z.number(),
  nioshRelCeiling_ppm: z.number(),
  oshaPelTwa_ppm: z.number(),
});

export type CarbonMonoxideIndicator = z.infer<typeof carbonMonoxideIndicatorSchema>;

const autoignitionIndicatorSchema = z.object({
  lowest_K: z.number().describe('lowest recorded autoignition temperature of the combustibles present'),
  lowest_C: z.number(),
  species: z.string(),
  source: z.string().describe('short name of the source of that value'),
  citation: z.string().describe('full citation of the source of that value'),
  streamAbove: z.boolean().describe('stream temperature at or above it'),
  operatingAbove: z.boolean().describe('operating temperature at or above it'),
  temperatureClass: z.string().nullable().describe('least demanding temperature class (IEC 60079-0) whose maximum surface temperature is below it; null where none is'),
  maxSurface_C: z.number().nullable().describe("that class's maximum surface temperature, °C"),
});

export type AutoignitionIndicator = z.infer<typeof autoignitionIndicatorSchema>;

const streamIndicatorsSchema = z.object({
  id: z.string(),
  name: z.string(),
  role: z.enum(STREAM_ROLES),
  roleAssumed: z.boolean().describe('true where the role was not given and outlet was assumed'),
  side: z.enum([...STREAM_SIDES, 'not given']),
  temperature_K: z.number(),
  temperature_C: z.number(),
  pressure_bar: z.number(),
  composition: z.array(speciesShareSchema).describe('gas-phase composition, species present (at or above the presence threshold), largest first'),
  condensedExcluded: z.array(z.string()).describe('condensed species left out of the gas phase'),
  combustibles: z.array(speciesShareSchema),
  combustible_percent: z.number(),
  oxygen_percent: z.number(),
  flammability: streamFlammabilitySchema.nullable().describe('null where the stream has no combustibles'),
  flammableOnMixingWithAir: z.boolean(),
  insideFlammableRange: z.boolean(),
  insideFlammableRangeFinding: z.enum(INSIDE_RANGE_FINDINGS),
  carbonMonoxide: carbonMonoxideIndicatorSchema.nullable().describe('null where the stream carries no CO (below the presence threshold)'),
  exposure: z.array(exposureIndicatorSchema).describe('every present species with an exposure limit, CO included'),
  hydrogenPartialPressure_bar: z.number(),
  autoignition: autoignitionIndicatorSchema.nullable().describe('null where the stream has no combustible with a recorded autoignition temperature'),
  unassessed: z.array(speciesShareSchema).describe('present species with no hazard entry (flammability and toxicity not assessed)'),
});

export type StreamIndicators = z.infer<typeof streamIndicatorsSchema>;

const standardRefSchema = z.object({ id: z.string(), number: z.string(), edition: z.string().describe('the edition or year cited'), title: z.string() });

export type StandardRef = z.infer<typeof standardRefSchema>;

const cautionSchema = z.object({
  id: z.string(),
  title: z.string(),
  severity: z.enum(SEVERITIES),
  text: z.string(),
  standards: z.array(standardRefSchema),
  triggeredBy: z.array(z.string()).describe('ids of the streams that triggered the caution; empty where the basis itself did'),
});

export type Caution = z.infer<typeof cautionSchema>;

export const EXPOSURE_LIMITS = ['oshaPelTwa', 'oshaPelCeiling', 'oshaPelPeak', 'nioshRelTwa', 'nioshRelStel', 'nioshRelCeiling', 'idlh', 'acgihTlvTwa', 'acgihTlvStel'] as const;

export type ExposureLimit = (typeof EXPOSURE_LIMITS)[number];

/** A pair of published limits in air (or in oxygen), vol %. */
const limitPairSchema = z.object({
  lfl_percent: z.number(),
  ufl_percent: z.number().nullable(),
  source: z.string(),
  citation: z.string(),
  memory: z.boolean(),
});

export type LimitPair = z.infer<typeof limitPairSchema>;

/** The hazard data of one substance (lib/hazards/data/substances.yaml), sources resolved. */
const substanceDataSchema = z.object({
  species: z.string().describe('species label as in lib/thermo (or the hazard-only label, Ni(CO)4)'),
  key: z.string().describe('short key for text templates: {h2.lfl}, {co.idlh}'),
  name: z.string(),
  cas: z.string(),
  formsOnly: z.boolean().describe('not a species of the thermodynamic data: named only where conditions can form it'),
  oxidant: z.boolean(),
  combustible: z.boolean().describe('has a lower flammable limit in air: burns'),
  lfl_percent: sourcedNumber.nullable(),
  ufl_percent: sourcedNumber.nullable(),
  alsoPublished: z.array(limitPairSchema).describe('other published limits, for information (not used in calculations)'),
  inOxygen: limitPairSchema.nullable(),
  autoignition_C: z.array(sourcedNumber),
  lowestAutoignition_C: sourcedNumber.nullable().describe('the lowest of autoignition_C, the one the indicators use; null where none is recorded'),
  minimumIgnitionEnergy_mJ: z.array(sourcedNumber),
  limitingOxygen_percent: sourcedNumber.nullable(),
  gasGroup: sourcedText.nullable(),
  temperatureClass: z
    .object({ id: z.string(), maxSurface_C: z.number() })
    .nullable()
    .describe('least demanding temperature class (IEC 60079-0) whose maximum surface temperature is below the lowest recorded autoignition temperature; null where none is recorded or no class is low enough'),
  exposure_ppm: z.partialRecord(z.enum(EXPOSURE_LIMITS), sourcedNumber),
  carcinogen: sourcedText.nullable(),
  inAir_percent: sourcedNumber.nullable().describe("oxygen only: its share of dry air, vol %"),
  enrichedAbove_percent: sourcedNumber.nullable().describe('oxygen only: the share above which gas counts as oxygen-enriched, vol %'),
  notes: z.array(sourcedText),
});

export type SubstanceData = z.infer<typeof substanceDataSchema>;

const substanceRowSchema = substanceDataSchema.extend({
  presence: z.enum(['in streams', 'can form']).describe('in a stream of the basis, or named because the basis\'s conditions can form it'),
});

export type SubstanceRow = z.infer<typeof substanceRowSchema>;

const methodNoteSchema = z.object({ id: z.string(), text: z.string() });

export type MethodNote = z.infer<typeof methodNoteSchema>;

export const hazardAssessmentSchema = z
  .object({
    notice: z.string().describe('the standing notice: informational only; local codes, the authority having jurisdiction and licensed practice govern'),
    basis: z.object({
      technology: z.enum(TECHNOLOGY_IDS),
      technologyName: z.string(),
      mode: z.enum(MODES),
      nickelBearing: z.boolean(),
      operatingTemperature_K: z.number(),
      fuelPressure_bar: z.number(),
      airPressure_bar: z.number(),
      ambientTemperature_K: z.number(),
      dcVoltage_V: z.number().describe('the DC voltage the electrical caution reads'),
      dcVoltageDescription: z.string().describe('what that voltage is (today the stack voltage: the series voltage of its cells)'),
    }),
    substances: z.array(substanceRowSchema),
    streams: z.array(streamIndicatorsSchema),
    cautions: z.array(cautionSchema).describe('sorted by severity (danger first), then in the order of the rule table'),
    method: z.array(methodNoteSchema),
  })
  .describe('hazard assessment from lib/hazards (notice, substances, stream indicators, cautions with their standards)');

export type HazardAssessment = z.infer<typeof hazardAssessmentSchema>;
