/** Species property and reaction evaluation rates (one core). */
import { getSpecies } from '../lib/thermo/species-data.ts';
import { speciesProperties } from '../lib/thermo/properties.ts';
import { parseEquation } from '../lib/electrochem/equation.ts';
import { reactionProperties } from '../lib/electrochem/reaction.ts';
import { formatRate, ratePerSecond, type Row } from './measure.ts';

export function benchThermo(): Row[] {
  const water = getSpecies('H2O');
  let t = 300;
  const species = ratePerSecond(() => {
    speciesProperties(water, t);
    t = t > 1900 ? 300 : t + 1.7;
  });
  const methane = parseEquation('CH4 + 2 O2 -> CO2 + 2 H2O');
  const reactions = ratePerSecond(() => {
    reactionProperties(methane, t);
    t = t > 1900 ? 300 : t + 1.7;
  });
  return [
    { section: 'thermo', measure: 'species property sets (cp, h, s, g) per second', value: formatRate(species) },
    { section: 'thermo', measure: 'reaction evaluations (4 species) per second', value: formatRate(reactions) },
  ];
}
