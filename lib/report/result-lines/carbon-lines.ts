/**
 * The worked line of the carbon margin: the design steam-to-carbon ratio less the carbon-free
 * minimum at the stack (and pre-reformer) temperature.
 */
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec } from '../calc-line.ts';

export function carbonLines(r: Results): LineSpec[] {
  const c = r.carbon;
  if (c.steamToCarbon === null || r.headline.carbonMargin === null || c.minimumSteamToCarbonStack === null) return [];
  const pre = c.minimumSteamToCarbonPreReformer;
  return [
    {
      id: 'carbon-margin',
      title: 'Margin of the steam-to-carbon ratio over the carbon limit',
      equation: 'carbon-margin',
      relation: pre === null ? 'stackOnly' : 'margin',
      quantities: [
        { name: 'sc', value: c.steamToCarbon, unit: '', origin: 'design input' },
        { name: 'st', value: c.minimumSteamToCarbonStack, unit: '', origin: 'ratio at which the carbon activity reaches 1 at the stack temperature' },
        ...(pre === null ? [] : [{ name: 'pr', value: pre, unit: '', origin: 'ratio at which the carbon activity reaches 1 at the pre-reformer temperature' }]),
      ],
      value: r.headline.carbonMargin,
      unit: '',
      digits: 4,
    },
  ];
}
