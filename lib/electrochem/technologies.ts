/**
 * Cell technologies (data/technologies.yaml): the ion each electrolyte carries, where water
 * forms, whether the fuel gas is re-equilibrated at the electrode, typical temperatures. The
 * technology ids are those of TECHNOLOGY_IDS, here and nowhere else: the data file must describe
 * exactly these, the basis schema, the hazard rules and the results take them from here.
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { parseQuantity } from '../core/units.ts';

export const TECHNOLOGY_IDS = ['solid-oxide', 'proton-ceramic', 'pem', 'ht-pem', 'alkaline', 'molten-carbonate'] as const;
export type TechnologyId = (typeof TECHNOLOGY_IDS)[number];

/** Other names a basis or the command line may give a technology by. */
const TECHNOLOGY_ALIASES: Readonly<Record<string, TechnologyId>> = { 'phosphoric-acid': 'ht-pem' };

/** Technology names a basis may give: the technology ids, then their aliases. */
export const TECHNOLOGY_NAMES: readonly [TechnologyId, ...string[]] = [...TECHNOLOGY_IDS, ...Object.keys(TECHNOLOGY_ALIASES)];

export const IONS = ['oxide', 'proton', 'carbonate', 'hydroxide'] as const;
export type Ion = (typeof IONS)[number];

export const MODES = ['power', 'electrolysis'] as const;
export type Mode = (typeof MODES)[number];

export interface Technology {
  id: TechnologyId;
  name: string;
  ion: Ion;
  waterElectrode: 'fuel' | 'air';
  waterPhase: 'gas' | 'liquid';
  fuelGasEquilibrium: boolean;
  modes: Mode[];
  typicalFromK: number;
  typicalToK: number;
}

const RawTechnology = z.strictObject({
  name: z.string().min(1),
  ion: z.enum(IONS),
  'water-electrode': z.enum(['fuel', 'air']),
  'water-phase': z.enum(['gas', 'liquid']),
  'fuel-gas-equilibrium': z.boolean(),
  modes: z.array(z.enum(MODES)).min(1),
  'temperature-range': z.strictObject({ from: z.string(), to: z.string() }),
});

let cache: Map<TechnologyId, Technology> | undefined;

export function technologies(): Map<TechnologyId, Technology> {
  if (cache) return cache;
  const raw = readDataFile(new URL('./data/technologies.yaml', import.meta.url), z.record(z.enum(TECHNOLOGY_IDS), RawTechnology));
  cache = new Map(
    TECHNOLOGY_IDS.map((id) => {
      const t = raw[id];
      return [
        id,
        {
          id,
          name: t.name,
          ion: t.ion,
          waterElectrode: t['water-electrode'],
          waterPhase: t['water-phase'],
          fuelGasEquilibrium: t['fuel-gas-equilibrium'],
          modes: t.modes,
          typicalFromK: parseQuantity(t['temperature-range'].from, 'temperature').si,
          typicalToK: parseQuantity(t['temperature-range'].to, 'temperature').si,
        },
      ];
    }),
  );
  return cache;
}

/** The id a technology name stands for (an id, or an alias of one); undefined for any other name. */
export function technologyIdOf(name: string): TechnologyId | undefined {
  if ((TECHNOLOGY_IDS as readonly string[]).includes(name)) return name as TechnologyId;
  return Object.hasOwn(TECHNOLOGY_ALIASES, name) ? TECHNOLOGY_ALIASES[name] : undefined;
}

export function technology(id: TechnologyId): Technology {
  const t = technologies().get(id);
  if (!t) throw new Error(`unknown technology ${id}`);
  return t;
}
