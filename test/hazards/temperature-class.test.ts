// The temperature class the area-classification caution recommends must have a maximum surface
// temperature below the lowest recorded autoignition temperature of every combustible present
// (the selection rule of IEC 60079-14:2013, from memory). The classes are written here from the
// IEC 60079-0:2017 table (T1 450, T2 300, T3 200, T4 135, T5 100, T6 85 °C; read in
// manufacturers' reproductions of the table), not from the data file, so that a wrong data file
// fails too. Before this test, n-butane (287 °C, NFPA 325) was given T2, which allows 300 °C.
import { describe, expect, it } from 'vitest';
import { assessHazards } from '../../lib/hazards/assessment.ts';
import { allSubstances } from '../../lib/hazards/substances.ts';
import { bareHazardInput, C } from '../helpers/hazard-input.ts';

const IEC_60079_0: [string, number][] = [
  ['T1', 450],
  ['T2', 300],
  ['T3', 200],
  ['T4', 135],
  ['T5', 100],
  ['T6', 85],
];

const base = bareHazardInput;

function recommendedClass(moleFractions: Record<string, number>): string {
  const a = assessHazards({ ...base, streams: [{ id: 'x', name: 'test stream', role: 'feed', temperatureK: 25 + C, pressureBar: 1.01325, moleFractions }] });
  const text = a.cautions.find((c) => c.id === 'flammable-area-classification')!.text;
  const m = /temperature class (T[1-6])/.exec(text);
  expect(m, text).not.toBeNull();
  return m![1]!;
}

const maxSurface = (id: string): number => IEC_60079_0.find(([c]) => c === id)![1];

const combustibles = allSubstances().filter((s) => s.combustible && !s.formsOnly && s.autoignition_C.length > 0);

describe('recommended temperature class (IEC 60079-0:2017 classes, below the lowest AIT)', () => {
  it('covers every combustible of the hazard data that streams can carry', () => {
    expect(combustibles.map((s) => s.species).sort()).toEqual(['C2H5OH', 'C2H6', 'C3H8', 'CH3OH', 'CH4', 'CO', 'H2', 'H2S', 'NH3', 'n-C4H10'].sort());
  });

  for (const s of combustibles) {
    it(`${s.name}: the class's maximum surface temperature is below every recorded AIT, and the next class up is not`, () => {
      const lowest = Math.min(...s.autoignition_C.map((v) => v.value));
      const id = recommendedClass({ [s.species]: 0.5, N2: 0.5 });
      expect(maxSurface(id)).toBeLessThan(lowest);
      const index = IEC_60079_0.findIndex(([c]) => c === id);
      if (index > 0) expect(IEC_60079_0[index - 1]![1]).toBeGreaterThanOrEqual(lowest);
    });
  }

  // The lowest AIT of each species as substances.yaml records it, with the class that follows by
  // hand from the IEC table: the least demanding class whose maximum surface temperature is
  // strictly below it.
  it.each([
    ['n-C4H10', 'n-butane 287 °C (NFPA 325)', 'T3'],
    ['H2S', 'hydrogen sulfide 260 °C (NFPA 325)', 'T3'],
    ['H2', 'hydrogen 400 °C (Zabetakis 1965)', 'T2'],
    ['C3H8', 'propane 450 °C (NFPA 325): not below T1 450 °C', 'T2'],
    ['CH3OH', 'methanol 385 °C (NRC Prudent Practices 1995)', 'T2'],
    ['C2H5OH', 'ethanol 363 °C (NFPA 325)', 'T2'],
    ['CH4', 'methane 537 °C (NFPA 325)', 'T1'],
    ['C2H6', 'ethane 472 °C (NFPA 325)', 'T1'],
    ['CO', 'carbon monoxide 605 °C (IEC 60079-20-1)', 'T1'],
    ['NH3', 'ammonia 630 °C (IEC 60079-20-1)', 'T1'],
  ])('%s: %s gives %s', (species, _why, expected) => {
    expect(recommendedClass({ [species]: 0.5, N2: 0.5 })).toBe(expected);
  });

  it('a natural gas with 0.2 % n-butane gets T3, set by the butane, and says so', () => {
    const moleFractions = { CH4: 0.912, C2H6: 0.052, C3H8: 0.011, 'n-C4H10': 0.002, CO2: 0.008, N2: 0.015 };
    expect(recommendedClass(moleFractions)).toBe('T3');
    const a = assessHazards({ ...base, streams: [{ id: 'gas', name: 'site gas', role: 'feed', temperatureK: 15 + C, pressureBar: 1.12, moleFractions }] });
    const text = a.cautions.find((c) => c.id === 'flammable-area-classification')!.text;
    expect(text).toMatch(/temperature class T3 .*200 °C.*287 °C.*n-butane/s);
  });

  it('the stream indicators carry the class of their lowest AIT', () => {
    const a = assessHazards({ ...base, streams: [{ id: 'x', name: 'x', role: 'feed', temperatureK: 25 + C, pressureBar: 1.01325, moleFractions: { H2: 0.5, H2S: 0.001, N2: 0.499 } }] });
    expect(a.streams[0]!.autoignition).toMatchObject({ lowest_C: 260, species: 'H2S', temperatureClass: 'T3', maxSurface_C: 200 });
  });
});
