// The alkaline cell's electrolyte water activity in its Nernst voltage and its product gases'
// vapour (issue 17 item 3). Before, a_w was 1: the alkaline electrolyser scaffold (30 wt % KOH,
// 80 °C, 16 bar) read E = 1.24571 V. With Balej's correlation (Int. J. Hydrogen Energy 10 (1985)
// 233-243; from memory) a_w = 0.61721 and, recomputed outside the repository with IAPWS-IF97 and
// E°(liquid water, 80 °C) = 1.18311 V (Larminie & Dicks, Table 2.2: 1.18 V, read in a reproduction of its p. 33),
// x_H2O = 0.61721 × 47.4147 kPa / 16 bar = 0.018290 and
// E = E° + RT/2F (1.5 ln(16 − 0.29265) − ln 0.61721) = 1.25332 V.
import { describe, expect, it } from 'vitest';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

describe('alkaline electrolyte water activity', () => {
  const r = scaffoldCase('alkaline', 'electrolysis').results;

  it('a_w of 30 wt % KOH at 80 °C is 0.61721, in the results', () => {
    expect(r.fuelPath.waterActivity).toBeCloseTo(0.61721, 4);
  });

  it('the hydrogen and oxygen leave with the vapour of the lye, not of pure water: x_H2O = 0.018290', () => {
    const side = r.fuelPath.points[0]!;
    expect(side.fuelSide.H2O!).toBeCloseTo(0.01829, 5);
    expect(side.airSide.H2O!).toBeCloseTo(0.01829, 5);
  });

  it('the Nernst voltage carries −RT/2F ln a_w: 1.25332 V (1.24571 V with a_w = 1), the pure-water E° unchanged', () => {
    expect(r.headline.meanNernst_V).toBeCloseTo(1.25332, 4);
    expect(r.electrochemistry.standardVoltage_V).toBeCloseTo(1.18311, 4);
    expect(r.fuelPath.standardVoltage_V - r.electrochemistry.standardVoltage_V).toBeCloseTo(0.0073426, 5);
  });

  it('a PEM cell stands over pure water: a_w = 1', () => {
    expect(scaffoldCase('pem', 'electrolysis').results.fuelPath.waterActivity).toBe(1);
  });
});
