/**
 * Composition presets (data/presets.yaml): dry-air, humid-air, oxygen, hydrogen, steam,
 * liquid-water, natural-gas, biogas. Each is a set of mole fractions with its source; humid-air
 * has none of its own and is completed from a humidity (humid-air.ts).
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';

export interface Preset {
  name: string;
  description: string;
  source: string;
  /** Species label → mole fraction (empty for humid-air until a humidity completes it). */
  composition: Record<string, number>;
  /** Needs a humidity: the composition is `base` plus water vapour. */
  humid: boolean;
  base?: string;
}

const RawPreset = z.strictObject({
  description: z.string(),
  source: z.string(),
  humid: z.boolean().optional(),
  base: z.string().optional(),
  composition: z.record(z.string(), z.strictObject({ fraction: z.number().positive().max(1), source: z.string() })).optional(),
});

let cache: Map<string, Preset> | undefined;

function presets(): Map<string, Preset> {
  if (cache) return cache;
  const raw = readDataFile(new URL('./data/presets.yaml', import.meta.url), z.record(z.string(), RawPreset));
  cache = new Map(
    Object.entries(raw).map(([name, p]) => [
      name,
      {
        name,
        description: p.description,
        source: p.source,
        composition: Object.fromEntries(Object.entries(p.composition ?? {}).map(([species, v]) => [species, v.fraction])),
        humid: p.humid === true,
        ...(p.base ? { base: p.base } : {}),
      },
    ]),
  );
  return cache;
}

export function presetNames(): string[] {
  return [...presets().keys()];
}

export function findPreset(name: string): Preset | undefined {
  return presets().get(name);
}
