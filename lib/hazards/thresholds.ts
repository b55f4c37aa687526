/**
 * Thresholds of the hazard indicators and cautions (data/thresholds.yaml), each with its source:
 * the presence threshold, the nickel-carbonyl temperature, the detector alarm fraction of the
 * LFL, the high-temperature hydrogen attack screening temperature, the pressures above which the
 * pressure-equipment rules apply and the DC voltage bands.
 */
import { readDataFile } from '../core/data-file.ts';
import { z } from 'zod';

const Threshold = z.strictObject({ value: z.number(), source: z.string(), memory: z.boolean(), why: z.string() });

const File = z.strictObject({
  presence_ppm: Threshold,
  nickelCarbonyl_C: Threshold,
  detectorAlarm_percentOfLfl: Threshold,
  hydrogenAttack_C: Threshold,
  pressureEquipmentEu_barGauge: Threshold,
  pressureVesselAsme_psiGauge: Threshold,
  extraLowVoltageDc_V: Threshold,
  lowVoltageDc_V: Threshold,
});

export type ThresholdId = keyof z.infer<typeof File>;
export type Threshold = z.infer<typeof Threshold>;

let cache: z.infer<typeof File> | undefined;

export function thresholds(): Record<ThresholdId, Threshold> {
  cache ??= readDataFile(new URL('./data/thresholds.yaml', import.meta.url), File);
  return cache;
}

export function threshold(id: ThresholdId): number {
  return thresholds()[id].value;
}

/** Mole fraction at or above which a species counts as present in a stream. */
export function presenceFraction(): number {
  return threshold('presence_ppm') * 1e-6;
}
