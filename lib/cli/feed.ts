/**
 * Feeds on the command line: "CH4=1, H2O=2" (species = amount, comma separated). Each species
 * once: a species written twice, under one name or two (H2O and H2O(g)), is refused rather than
 * summed, as a composition of a basis refuses it.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { UserError } from '../core/errors.ts';

export function parseFeedOption(text: string, option = 'feed'): Record<string, number> {
  const feed: Record<string, number> = {};
  const givenAs = new Map<string, string>();
  const parts = text.split(',').map((p) => p.trim()).filter((p) => p !== '');
  if (parts.length === 0) throw new UserError(`--${option}: give species and amounts such as "CH4=1, H2O=2"`);
  for (const part of parts) {
    const match = /^([^=\s]+)\s*=\s*(\S+)$/.exec(part);
    if (!match) throw new UserError(`--${option}: cannot read "${part}"; write SPECIES=AMOUNT, such as "CH4=1, H2O=2"`);
    const species = getSpecies(match[1]!);
    const amount = Number(match[2]);
    if (!Number.isFinite(amount)) throw new UserError(`--${option}: the amount of ${species.label} is not a number: "${match[2]}"`);
    if (amount < 0) throw new UserError(`--${option}: the amount of ${species.label} is negative (${amount})`);
    if (species.phase !== 'gas') throw new UserError(`--${option}: ${species.label} is a condensed phase; the feed is a gas (give H2O for water)`);
    const earlier = givenAs.get(species.label);
    if (earlier !== undefined) {
      const same = earlier === match[1] ? `${earlier} is given twice` : `${match[1]} is the same species as ${earlier}, already given`;
      throw new UserError(`--${option}: ${same}; give each species once`);
    }
    givenAs.set(species.label, match[1]!);
    feed[species.label] = amount;
  }
  const total = Object.values(feed).reduce((a, b) => a + b, 0);
  if (!(total > 0)) throw new UserError(`--${option}: the total amount must be positive`);
  return feed;
}
