/**
 * Cell technologies (data/technologies.yaml): the ion each electrolyte carries, where water
 * forms, whether the fuel gas is re-equilibrated at the electrode, typical temperatures.
 */
import { readFileSync } from 'node:fs';
import { parse as parseYaml } from 'yaml';
import { parseQuantity } from '../core/units.ts';

export type Ion = 'oxide' | 'proton' | 'carbonate' | 'hydroxide';
export type Mode = 'power' | 'electrolysis';
export type TechnologyId = 'solid-oxide' | 'proton-ceramic' | 'pem' | 'ht-pem' | 'alkaline' | 'molten-carbonate';

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

interface Raw {
  name: string;
  ion: Ion;
  'water-electrode': 'fuel' | 'air';
  'water-phase': 'gas' | 'liquid';
  'fuel-gas-equilibrium': boolean;
  modes: Mode[];
  'temperature-range': { from: string; to: string };
}

let cache: Map<TechnologyId, Technology> | undefined;

export function technologies(): Map<TechnologyId, Technology> {
  if (cache) return cache;
  const raw = parseYaml(readFileSync(new URL('./data/technologies.yaml', import.meta.url), 'utf8')) as Record<TechnologyId, Raw>;
  cache = new Map(
    (Object.entries(raw) as [TechnologyId, Raw][]).map(([id, t]) => [
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
    ]),
  );
  return cache;
}

export const TECHNOLOGY_IDS = ['solid-oxide', 'proton-ceramic', 'pem', 'ht-pem', 'alkaline', 'molten-carbonate'] as const satisfies readonly TechnologyId[];

export function technology(id: TechnologyId): Technology {
  const t = technologies().get(id);
  if (!t) throw new Error(`unknown technology ${id}`);
  return t;
}
