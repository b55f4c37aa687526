/**
 * What an efficiency figure is measured against, said beside the figure where it could mislead:
 * a figure above 100 % is not energy made from nothing but a ratio whose denominator leaves out
 * an energy the stack receives (issue 17 item 4).
 *
 * - Power mode, −ΔG(T)/LHV above 1: the fuel's oxidation gains entropy (ΔS > 0), so −ΔG = −ΔH + TΔS
 *   exceeds the heat of combustion and an ideal cell would turn heat taken from its surroundings
 *   into work (Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., §2.3; e.g. C + ½O2 → CO).
 * - Electrolysis over electricity alone above 1: the heat the stack absorbs below thermoneutral
 *   and, on HHV, the latent heat the steam feed brings (the HHV counts the water as liquid) are
 *   supplied from outside; the heat-inclusive figure counts them.
 */
import type { Results } from '../plant/results-schema.ts';
import { formatPercent, formatPower } from './format.ts';

/** The note for each efficiency figure that needs one, by the results key it stands beside. */
export function efficiencyBasisNotes(r: Results): Partial<Record<keyof Results['efficiency'], string>> {
  const e = r.efficiency;
  const notes: Partial<Record<keyof Results['efficiency'], string>> = {};
  const aboveOne = (v: number | null): v is number => v !== null && v > 1;
  for (const key of ['thermodynamicLimitLhv', 'thermodynamicLimitHhv'] as const) {
    if (aboveOne(e[key])) {
      notes[key] =
        `above 100 % because this fuel's oxidation gains entropy at the stack temperature: −ΔG = −ΔH + TΔS exceeds the heat of combustion, and an ideal cell would turn heat from its surroundings into work`;
    }
  }
  if (r.technology.mode === 'electrolysis') {
    const supplied: string[] = [];
    if (r.heat.heatDemand_W !== null && r.heat.heatDemand_W > 0) supplied.push(`the ${formatPower(r.heat.heatDemand_W)} of heat the stack absorbs below thermoneutral`);
    const latent = e.steamLatentHeat_W;
    for (const key of ['electrolysisEfficiencyLhv', 'electrolysisEfficiencyHhv'] as const) {
      const value = e[key];
      if (!aboveOne(value)) continue;
      const hhv = key === 'electrolysisEfficiencyHhv';
      const parts = [...supplied, ...(hhv && latent !== null && latent > 0 ? [`the ${formatPower(latent)} of latent heat the steam feed brings, which the HHV counts (water as liquid)`] : [])];
      const counted = hhv ? e.heatInclusiveEfficiencyHhv : e.heatInclusiveEfficiencyLhv;
      notes[key] =
        `over electricity alone; above 100 % because ${parts.length ? parts.join(' and ') : 'energy other than electricity reaches the stack'} ${parts.length > 1 ? 'are' : 'is'} supplied from outside` +
        (counted !== null ? `; with that heat counted the efficiency is ${formatPercent(counted)}` : '');
    }
  }
  return notes;
}
