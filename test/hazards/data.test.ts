// Hazard data against the tables they cite. Each value is checked exactly (toBe): the data file
// copies the published table, so there is no tolerance to allow; the source and whether it is
// quoted from memory are named beside each check, as in substances.yaml.
import { describe, expect, it } from 'vitest';
import { allSubstances, substance } from '../../lib/hazards/substances.ts';
import { standard, standards } from '../../lib/hazards/standards.ts';
import { thresholds } from '../../lib/hazards/thresholds.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';

const limits = (label: string) => [substance(label).lfl_percent?.value, substance(label).ufl_percent?.value];

describe('flammability limits in air, vol %', () => {
  it('hydrogen 4.0 to 75 (ISO/TR 15916:2015, from memory; Zabetakis 1965 and NFPA 497 agree, from memory)', () => {
    expect(limits('H2')).toEqual([4.0, 75]);
    expect(substance('H2').lfl_percent!.source).toBe('ISO/TR 15916:2015');
    expect(substance('H2').lfl_percent!.memory).toBe(true);
  });
  it('carbon monoxide 12.5 to 74 (OSHA chemical database, read; Zabetakis 1965 agrees, from memory)', () => {
    expect(limits('CO')).toEqual([12.5, 74]);
    expect(substance('CO').lfl_percent!.memory).toBe(false);
  });
  it('methane 5.0 to 15.0 (Zabetakis 1965, Bulletin 627, from memory); IEC 60079-20-1 4.4 to 17 listed, not used', () => {
    expect(limits('CH4')).toEqual([5.0, 15.0]);
    expect(substance('CH4').alsoPublished).toContainEqual(expect.objectContaining({ lfl_percent: 4.4, ufl_percent: 17.0 }));
  });
  it.each([
    ['C2H6', 3.0, 12.4],
  ])('%s %d to %d (Zabetakis 1965, Bulletin 627, from memory)', (label, lfl, ufl) => {
    expect(limits(label)).toEqual([lfl, ufl]);
    expect(substance(label).lfl_percent!.source).toMatch(/Zabetakis 1965/);
  });
  it('hydrogen sulfide 4.0 (NIOSH IDLH documentation 1994, read) to 44 (Zabetakis 1965, from memory); NRC Prudent Practices 1995 4.3 to 45.5 listed, read', () => {
    expect(limits('H2S')).toEqual([4.0, 44]);
    expect([substance('H2S').lfl_percent!.memory, substance('H2S').ufl_percent!.memory]).toEqual([false, true]);
    expect(substance('H2S').alsoPublished).toContainEqual(expect.objectContaining({ lfl_percent: 4.3, ufl_percent: 45.5, memory: false }));
  });
  it('propane 2.1 to 9.5 (OSHA chemical database, read; Zabetakis 1965 agrees, from memory)', () => {
    expect(limits('C3H8')).toEqual([2.1, 9.5]);
    expect(substance('C3H8').lfl_percent).toMatchObject({ source: 'OSHA chemical database', memory: false });
  });
  it('ethanol 3.3 to 19 (NIOSH Pocket Guide, read; Zabetakis 1965 agrees, from memory)', () => {
    expect(limits('C2H5OH')).toEqual([3.3, 19]);
    expect(substance('C2H5OH').lfl_percent!.memory).toBe(false);
  });
  it('ammonia 15 to 28 (International Chemical Safety Card 0414, read; Zabetakis 1965 agrees, from memory)', () => {
    expect(limits('NH3')).toEqual([15, 28]);
    expect(substance('NH3').lfl_percent).toMatchObject({ source: 'ICSC (IPCS/ILO)', memory: false });
  });
  it('methanol 6.0 to 36.5 (National Academies Press record 11170, read; the NIOSH IDLH documentation gives the same 6.0 % LEL, read); Zabetakis 1965 6.7 to 36 listed, from memory', () => {
    expect(limits('CH3OH')).toEqual([6.0, 36.5]);
    expect(substance('CH3OH').lfl_percent!.memory).toBe(false);
    expect(substance('CH3OH').alsoPublished).toContainEqual(expect.objectContaining({ lfl_percent: 6.0, memory: false }));
    expect(substance('CH3OH').alsoPublished).toContainEqual(expect.objectContaining({ lfl_percent: 6.7, ufl_percent: 36, memory: true }));
  });
  it('n-butane 1.6 to 8.4 (NIOSH Pocket Guide web page, npgd0068, read); Zabetakis 1965 1.8 to 8.4 listed, from memory', () => {
    expect(limits('n-C4H10')).toEqual([1.6, 8.4]);
    expect(substance('n-C4H10').lfl_percent).toMatchObject({ source: 'NIOSH Pocket Guide (web)', memory: false });
    expect(substance('n-C4H10').alsoPublished).toContainEqual(expect.objectContaining({ lfl_percent: 1.8, ufl_percent: 8.4, memory: true }));
  });
  it('nickel carbonyl LFL 2 % (NIOSH IDLH documentation 1994, read); no UFL recorded', () => {
    expect(limits('Ni(CO)4')).toEqual([2, undefined]);
  });
  it('hydrogen in oxygen from 4.0 to 94 (Zabetakis 1965, from memory)', () => {
    expect(substance('H2').inOxygen).toMatchObject({ lfl_percent: 4.0, ufl_percent: 94 });
  });
});

describe('autoignition temperatures, °C: every source kept, the lowest used', () => {
  it('hydrogen 585 (ISO/TR 15916), 560 (IEC 60079-20-1), 500 (NFPA 497), 400 (Zabetakis 1965), all from memory; 400 used', () => {
    const h2 = substance('H2');
    expect(h2.autoignition_C.map((v) => [v.value, v.source])).toEqual([
      [585, 'ISO/TR 15916:2015'],
      [560, 'IEC 60079-20-1:2010'],
      [500, 'NFPA 497'],
      [400, 'Zabetakis 1965, USBM Bulletin 627'],
    ]);
    expect(h2.lowestAutoignition_C).toMatchObject({ value: 400, source: 'Zabetakis 1965, USBM Bulletin 627' });
  });
  it('methane 600 (IEC 60079-20-1) and 537 (NFPA 325, historical), from memory; 537 used', () => {
    expect(substance('CH4').lowestAutoignition_C!.value).toBe(537);
  });
  it('carbon monoxide 609 (National Research Council, Prudent Practices 1995, read) and 605 (IEC 60079-20-1, from memory); 605 used', () => {
    expect(substance('CO').autoignition_C.map((v) => [v.value, v.memory])).toEqual([[609, false], [605, true]]);
    expect(substance('CO').lowestAutoignition_C!.value).toBe(605);
  });
  it('ammonia 690 (National Research Council, Prudent Practices 1995, read), 651 (International Chemical Safety Card 0414, read) and 630 (IEC 60079-20-1, from memory); 630 used', () => {
    expect(substance('NH3').autoignition_C.map((v) => v.value)).toEqual([690, 651, 630]);
    expect(substance('NH3').lowestAutoignition_C!.value).toBe(630);
  });
  it('methanol 385 (National Research Council, Prudent Practices 1995, read) is the lowest of its three', () => {
    expect(substance('CH3OH').autoignition_C).toHaveLength(3);
    expect(substance('CH3OH').lowestAutoignition_C).toMatchObject({ value: 385, memory: false });
  });
  it('hydrogen sulfide 260 (National Research Council, Prudent Practices 1995, read)', () => {
    expect(substance('H2S').lowestAutoignition_C).toMatchObject({ value: 260, memory: false });
  });
});

describe('minimum ignition energy, mJ', () => {
  it('hydrogen 0.017 (ISO/TR 15916) and 0.019 (Lewis and von Elbe 1987), both from memory: within 0.017-0.02', () => {
    const mie = substance('H2').minimumIgnitionEnergy_mJ.map((v) => v.value);
    expect(mie).toEqual([0.017, 0.019]);
    for (const v of mie) expect(v >= 0.017 && v <= 0.02).toBe(true);
  });
  it('methane 0.28 (Lewis and von Elbe 1987, from memory)', () => {
    expect(substance('CH4').minimumIgnitionEnergy_mJ[0]!.value).toBe(0.28);
  });
});

describe('exposure limits, ppm', () => {
  it('carbon monoxide: IDLH 1200 (NIOSH, as NLM Haz-Map gives it, read), NIOSH REL 35 TWA and 200 ceiling, OSHA PEL 50, ACGIH TLV 25 (NIOSH IDLH documentation, May 1994, read)', () => {
    const e = substance('CO').exposure_ppm;
    expect([e.idlh?.value, e.nioshRelTwa?.value, e.nioshRelCeiling?.value, e.oshaPelTwa?.value, e.acgihTlvTwa?.value]).toEqual([1200, 35, 200, 50, 25]);
    expect(Object.values(e).every((v) => !v.memory)).toBe(true);
  });
  it('nickel carbonyl: OSHA PEL and NIOSH REL 0.001 TWA, IDLH 2, ACGIH TLV 0.05 (NIOSH IDLH documentation and OSHA database, read); a carcinogen', () => {
    const n = substance('Ni(CO)4');
    expect([n.exposure_ppm.oshaPelTwa?.value, n.exposure_ppm.nioshRelTwa?.value, n.exposure_ppm.idlh?.value, n.exposure_ppm.acgihTlvTwa?.value]).toEqual([0.001, 0.001, 2, 0.05]);
    expect(n.carcinogen?.value).toMatch(/carcinogen/);
    expect(n.formsOnly).toBe(true);
  });
  it('ammonia: NIOSH REL 25 TWA and 35 STEL, OSHA PEL 50 (NIOSH IDLH documentation 1994, read), IDLH 300 (NIOSH IDLH documentation 1994, from memory)', () => {
    const e = substance('NH3').exposure_ppm;
    expect([e.nioshRelTwa?.value, e.nioshRelStel?.value, e.oshaPelTwa?.value, e.idlh?.value]).toEqual([25, 35, 50, 300]);
  });
  it('methanol: NIOSH REL 200 TWA and 250 STEL, OSHA PEL 200 (NIOSH IDLH documentation 1994, read), IDLH 6000 = 10 % of its 6.0 % LEL (NIOSH, as NLM Haz-Map gives it, read)', () => {
    const e = substance('CH3OH').exposure_ppm;
    expect([e.nioshRelTwa?.value, e.nioshRelStel?.value, e.oshaPelTwa?.value, e.idlh?.value]).toEqual([200, 250, 200, 6000]);
    expect(Object.values(e).every((v) => !v.memory)).toBe(true);
  });
  it('hydrogen sulfide: NIOSH REL 10 ceiling, OSHA PEL 20 ceiling and 50 peak (NIOSH IDLH documentation 1994, read), IDLH 100, ACGIH TLV 1 TWA and 5 STEL (PubMed Central table PMC5777517, read)', () => {
    const e = substance('H2S').exposure_ppm;
    expect([e.nioshRelCeiling?.value, e.oshaPelCeiling?.value, e.oshaPelPeak?.value, e.idlh?.value]).toEqual([10, 20, 50, 100]);
    expect([e.acgihTlvTwa?.value, e.acgihTlvStel?.value]).toEqual([1, 5]);
    expect(Object.values(e).every((v) => !v.memory)).toBe(true);
  });
  it('carbon dioxide: NIOSH REL 5000 TWA and 30000 STEL, OSHA PEL 5000 (NIOSH IDLH documentation 1994, read), IDLH 40000 (NIOSH Pocket Guide, read)', () => {
    const e = substance('CO2').exposure_ppm;
    expect([e.nioshRelTwa?.value, e.nioshRelStel?.value, e.oshaPelTwa?.value, e.idlh?.value]).toEqual([5000, 30000, 5000, 40000]);
    expect(Object.values(e).every((v) => !v.memory)).toBe(true);
  });
  it('propane: NIOSH REL and OSHA PEL 1000 TWA, IDLH 2100 = 10 % of its 2.1 % LEL (NIOSH IDLH documentation 1994, read)', () => {
    const e = substance('C3H8').exposure_ppm;
    expect([e.nioshRelTwa?.value, e.oshaPelTwa?.value, e.idlh?.value]).toEqual([1000, 1000, 2100]);
  });
  it('n-butane: NIOSH REL 800 TWA, IDLH 1600 = 10 % of its 1.6 % LEL, no OSHA PEL (NIOSH Pocket Guide web page, read)', () => {
    const e = substance('n-C4H10').exposure_ppm;
    expect([e.nioshRelTwa?.value, e.idlh?.value, e.oshaPelTwa]).toEqual([800, 1600, undefined]);
  });
  it('ethanol: NIOSH REL, OSHA PEL and ACGIH TLV 1000 TWA, IDLH 3300 = 10 % of its 3.3 % LEL (NIOSH IDLH documentation 1994 and Pocket Guide, read)', () => {
    const e = substance('C2H5OH').exposure_ppm;
    expect([e.nioshRelTwa?.value, e.oshaPelTwa?.value, e.acgihTlvTwa?.value, e.idlh?.value]).toEqual([1000, 1000, 1000, 3300]);
  });
});

describe('the data file itself', () => {
  it('covers every substance of the brief under the species labels of lib/thermo', () => {
    for (const label of ['H2', 'CO', 'CH4', 'C2H6', 'C3H8', 'n-C4H10', 'NH3', 'CH3OH', 'C2H5OH', 'H2S', 'Ni(CO)4']) {
      expect(substance(label).species).toBe(label);
    }
    for (const s of allSubstances().filter((s) => !s.formsOnly)) expect(getSpecies(s.species).label).toBe(s.species);
  });
  it('gives every value a source and a memory flag, and UFL ≥ LFL', () => {
    for (const s of allSubstances()) {
      const values = [s.lfl_percent, s.ufl_percent, ...s.autoignition_C, ...s.minimumIgnitionEnergy_mJ, s.limitingOxygen_percent, s.gasGroup, ...Object.values(s.exposure_ppm), ...s.notes];
      for (const v of values.filter((v) => v !== null)) {
        expect(v!.source.length, s.species).toBeGreaterThan(0);
        expect(v!.citation.length, s.species).toBeGreaterThan(0);
        expect(typeof v!.memory).toBe('boolean');
      }
      if (s.lfl_percent && s.ufl_percent) expect(s.ufl_percent.value).toBeGreaterThan(s.lfl_percent.value);
    }
  });
  it('oxygen: 20.95 % in dry air (U.S. Standard Atmosphere 1976), enriched above 23.5 % (29 CFR 1910.146), both from memory', () => {
    expect(substance('O2').inAir_percent!.value).toBe(20.95);
    expect(substance('O2').enrichedAbove_percent!.value).toBe(23.5);
  });
  it('states every threshold with its source', () => {
    for (const [id, t] of Object.entries(thresholds())) {
      expect(t.source.length, id).toBeGreaterThan(10);
      expect(t.why.length, id).toBeGreaterThan(10);
    }
    expect(thresholds().detectorAlarm_percentOfLfl.value).toBe(25);
    expect(thresholds().nickelCarbonyl_C.value).toBe(200);
  });
});

describe('standards cited by the cautions', () => {
  it('has the full number and title of the standards the brief names', () => {
    expect(standard('nfpa-2')).toMatchObject({ number: 'NFPA 2', title: 'Hydrogen Technologies Code' });
    expect(standard('nfpa-853').title).toBe('Standard for the Installation of Stationary Fuel Cell Power Systems');
    expect(standard('iec-62282-3-100').title).toMatch(/Stationary fuel cell power systems - Safety/);
    expect(standard('iec-62282-3-300').title).toMatch(/Installation/);
    expect(standard('iso-tr-15916').title).toBe('Basic considerations for the safety of hydrogen systems');
    expect(standard('iec-60079-10-1').title).toMatch(/Classification of areas - Explosive gas atmospheres/);
    expect(standard('asme-b31-12').title).toBe('Hydrogen Piping and Pipelines');
    expect(standard('cga-g-5-4').title).toBe('Standard for Hydrogen Piping Systems at User Locations');
    expect(standard('cga-g-5-5').title).toBe('Standard for Hydrogen Vent Systems');
    expect(standard('iso-22734').title).toMatch(/water electrolysis/);
  });
  it('gives every standard a publisher, a scope, an edition naming its year and the memory flag; one read says what was read', () => {
    for (const s of standards().values()) {
      expect(s.publisher.length, s.id).toBeGreaterThan(0);
      expect(s.scope.length, s.id).toBeGreaterThan(10);
      expect(s.edition, s.id).toMatch(/\b(19|20)\d\d\b/);
      if (!s.memory) expect(s.scope, s.id).toMatch(/\bread\b/);
    }
  });
});
