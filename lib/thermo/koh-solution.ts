/**
 * Water in aqueous potassium hydroxide, the electrolyte of alkaline cells: its molality from the
 * mass fraction and the water activity by the correlation of J. Balej (Int. J. Hydrogen Energy 10
 * (1985) 233-243), with its coefficients and range in data/koh-water-activity-balej-1985.yaml:
 *
 *   m = w / ((1 − w) M_KOH)                                         mol/kg of water
 *   log10 p_w(H2O) = c0 + c1/T + c2 log10 T + c3 T                  bar (Balej's pure-water line)
 *   log10 p_w(KOH) = a1 m + a2 m² + a3 m³ + (1 + b1 m + b2 m² + b3 m³) log10 p_w(H2O)
 *   a_w = p_w(KOH) / p_w(H2O)
 *       = 10^(a1 m + a2 m² + a3 m³ + (b1 m + b2 m² + b3 m³) log10 p_w(H2O))
 *
 * The activity, a ratio of two of Balej's own pressures, is what the cell uses: the water vapour
 * over the electrolyte is a_w · p_s(T) with p_s by IAPWS-IF97 (water-saturation.ts), and the
 * Nernst voltage carries a_w for the electrolyte's water. Valid for 2 to 18 mol/kg (10.1 to 50.2
 * wt %) and 0 to 200 °C; outside it an error says so.
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { UserError } from '../core/errors.ts';

const Balej = z.strictObject({
  vapourPressureOverSolution: z.strictObject({ a1: z.number(), a2: z.number(), a3: z.number(), b1: z.number(), b2: z.number(), b3: z.number() }),
  vapourPressureOfWater: z.strictObject({ c0: z.number(), c1: z.number(), c2: z.number(), c3: z.number() }),
  molarMass_g_per_mol: z.number().positive(),
  validity: z.strictObject({
    lowestMolality_mol_per_kg: z.number().positive(),
    highestMolality_mol_per_kg: z.number().positive(),
    lowestTemperature_K: z.number().positive(),
    highestTemperature_K: z.number().positive(),
  }),
});

type Balej = z.infer<typeof Balej>;

let data: Balej | undefined;

function balej(): Balej {
  data ??= readDataFile(new URL('./data/koh-water-activity-balej-1985.yaml', import.meta.url), Balej);
  return data;
}

/** Molality of KOH, mol per kg of water, of a solution with mass fraction w: m = w / ((1 − w) M_KOH). */
export function kohMolality(massFraction: number): number {
  return massFraction / ((1 - massFraction) * (balej().molarMass_g_per_mol / 1000));
}

/** The inverse, w = m M / (1 + m M): the mass fraction of a molality. */
function massFractionOf(molality: number): number {
  const mm = molality * (balej().molarMass_g_per_mol / 1000);
  return mm / (1 + mm);
}

/** The correlation's range as mass fractions and temperatures, for the basis to check its inputs against. */
export function kohCorrelationRange(): { lowMassFraction: number; highMassFraction: number; lowK: number; highK: number } {
  const v = balej().validity;
  return {
    lowMassFraction: massFractionOf(v.lowestMolality_mol_per_kg),
    highMassFraction: massFractionOf(v.highestMolality_mol_per_kg),
    lowK: v.lowestTemperature_K,
    highK: v.highestTemperature_K,
  };
}

/** A concentration or temperature outside the range of Balej's correlation. */
export class KohRangeError extends UserError {
  constructor(message: string) {
    super(message);
    this.name = 'KohRangeError';
  }
}

/** Balej's pure-water vapour pressure, bar: log10 p = c0 + c1/T + c2 log10 T + c3 T. */
export function balejWaterVapourPressureBar(temperatureK: number): number {
  const c = balej().vapourPressureOfWater;
  return 10 ** (c.c0 + c.c1 / temperatureK + c.c2 * Math.log10(temperatureK) + c.c3 * temperatureK);
}

/**
 * Water activity of aqueous KOH of mass fraction w at T (Balej 1985, see the module comment):
 *   a_w = 10^(a1 m + a2 m² + a3 m³ + (b1 m + b2 m² + b3 m³) log10 p_w(H2O, T)).
 */
export function kohWaterActivity(massFraction: number, temperatureK: number): number {
  const range = kohCorrelationRange();
  const percent = (w: number) => `${(w * 100).toFixed(1)} wt %`;
  const m = kohMolality(massFraction);
  const v = balej().validity;
  // The range is in molality; a mass fraction converted from its end may land an ulp outside.
  if (!(m >= v.lowestMolality_mol_per_kg * (1 - 1e-12) && m <= v.highestMolality_mol_per_kg * (1 + 1e-12))) {
    throw new KohRangeError(`KOH at ${percent(massFraction)} is outside the range of Balej's correlation, ${percent(range.lowMassFraction)} to ${percent(range.highMassFraction)}`);
  }
  if (!(temperatureK >= range.lowK && temperatureK <= range.highK)) {
    throw new KohRangeError(`${temperatureK.toFixed(2)} K is outside the range of Balej's correlation for KOH, ${range.lowK} K to ${range.highK} K`);
  }
  const { a1, a2, a3, b1, b2, b3 } = balej().vapourPressureOverSolution;
  const logWater = Math.log10(balejWaterVapourPressureBar(temperatureK));
  return 10 ** (a1 * m + a2 * m * m + a3 * m ** 3 + (b1 * m + b2 * m * m + b3 * m ** 3) * logWater);
}
