// Liquid-water cells name their streams and quantities for what they are (issue 21 item 6): the
// water fed to a PEM electrolyser's oxygen electrode is a water feed, not an "air-electrode feed",
// its inlet a water inlet, and the fraction of it split per pass a water conversion, not a
// "steam conversion" (the water is liquid). Facts of the trade: a PEM electrolyser is fed liquid
// water at its anode (oxygen electrode); an alkaline one keeps its water in the circulating lye.
import { describe, expect, it } from 'vitest';
import { basisSummaryRows } from '../../lib/basis/summary.ts';
import { headlineTable } from '../../lib/report/sections/summary.ts';
import { documentText, scaffoldCase } from '../helpers/scaffold-cases.ts';

describe('stream and quantity names of liquid-water cells', () => {
  it('a PEM electrolyser: water feed (oxygen electrode), water inlet temperature, water conversion per pass; no air-electrode feed, no steam conversion', () => {
    const text = documentText('pem', 'electrolysis');
    expect(text).toContain('Water feed (oxygen electrode)');
    expect(text).toContain('water inlet temperature');
    expect(text).toContain('water conversion per pass');
    expect(text).not.toMatch(/air-electrode feed/i);
    expect(text).not.toMatch(/steam conversion/i);
    expect(text).not.toMatch(/air inlet temperature/i);
  });

  it('an alkaline electrolyser: its water is fed to the electrolyte', () => {
    const text = documentText('alkaline', 'electrolysis');
    expect(text).toContain('Water feed (to the electrolyte)');
    expect(text).not.toMatch(/air-electrode feed/i);
    expect(text).not.toMatch(/steam conversion/i);
  });

  it('the basis summary and the command line name them the same way', () => {
    const c = scaffoldCase('pem', 'electrolysis');
    const summary = basisSummaryRows(c.basis).map((r) => r[0]);
    expect(summary).toContain('water feed (oxygen electrode)');
    expect(summary).toContain('water conversion per pass');
    expect(summary).not.toContain('steam conversion');
    // The command line prints the document's headline table (calc and check).
    expect(headlineTable(c.results).rows.map((r) => r.cells[0])).toContain('Water feed (oxygen electrode)');
  });

  it('gas cells keep their names: a solid oxide electrolyser has a steam feed and a steam conversion; a fuel cell an air-electrode feed', () => {
    const soec = scaffoldCase('solid-oxide', 'electrolysis');
    expect(basisSummaryRows(soec.basis).map((r) => r[0])).toEqual(expect.arrayContaining(['steam feed (fuel electrode)', 'steam conversion']));
    expect(documentText('pem', 'power')).toContain('Air-electrode feed');
  });
});
