/**
 * Temperature classes of electrical equipment for explosive gas atmospheres
 * (data/temperature-classes.yaml: the six Group II classes of IEC 60079-0:2017 and their maximum
 * surface temperatures). The class a gas needs is the least demanding one whose maximum surface
 * temperature is strictly below the gas's ignition temperature,
 *
 *   class(AIT) = the first of T1…T6 with T_max,surface < AIT,
 *
 * the selection rule of IEC 60079-14:2013 (equipment's maximum surface temperature below the
 * ignition temperature of every gas that can be present). cellbasis applies it to the lowest
 * autoignition temperature recorded for a combustible, across all its sources.
 */
import { readDataFile } from '../core/data-file.ts';
import { z } from 'zod';

const File = z.strictObject({
  source: z.string(),
  memory: z.boolean(),
  classes: z
    .array(z.strictObject({ id: z.string().regex(/^T[1-6]$/), maxSurface_C: z.number().positive() }))
    .min(1)
    .refine((c) => c.every((x, i) => i === 0 || x.maxSurface_C < c[i - 1]!.maxSurface_C), 'classes must go from the least to the most demanding (falling maximum surface temperature)'),
});

export interface TemperatureClass {
  id: string;
  maxSurface_C: number;
}

let cache: z.infer<typeof File> | undefined;

function table(): z.infer<typeof File> {
  cache ??= readDataFile(new URL('./data/temperature-classes.yaml', import.meta.url), File);
  return cache;
}

/** The classes from the least to the most demanding (T1 first). */
function temperatureClasses(): readonly TemperatureClass[] {
  return table().classes;
}

/**
 * The least demanding class whose maximum surface temperature is below `autoignition_C`; null
 * where even the most demanding one (T6, 85 °C) is not below it.
 */
export function temperatureClassBelow(autoignition_C: number): TemperatureClass | null {
  return temperatureClasses().find((c) => c.maxSurface_C < autoignition_C) ?? null;
}
