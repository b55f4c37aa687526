// Whole bases: a methane-fed solid oxide cell with a nickel anode, a pure-hydrogen PEM cell and a
// PEM electrolyser. The compositions are round illustrative numbers of the right kind (steam to
// carbon 2; anode outlet at high fuel utilisation; PEM anode gas saturated with water at 70 °C),
// not results of the plant calculation.
import { describe, expect, it } from 'vitest';
import { assessHazards } from '../../lib/hazards/assessment.ts';
import { formatHazardsText } from '../../lib/hazards/format-text.ts';
import { HAZARD_NOTICE } from '../../lib/hazards/notice.ts';
import type { Caution, HazardAssessment, HazardInput } from '../../lib/hazards/types.ts';

const C = 273.15;

const sofc: HazardInput = {
  technology: 'solid-oxide',
  mode: 'power',
  nickelBearing: true,
  operatingTemperatureK: 800 + C,
  fuelPressureBar: 1.05,
  airPressureBar: 1.05,
  ambientTemperatureK: 25 + C,
  dcVoltage: { voltageV: 240, description: 'the stack voltage' },
  streams: [
    { id: 'fuel-inlet', name: 'fuel inlet', role: 'feed', side: 'fuel', temperatureK: 150 + C, pressureBar: 1.05, moleFractions: { CH4: 1 / 3, H2O: 2 / 3 } },
    { id: 'anode-outlet', name: 'anode outlet', role: 'outlet', side: 'fuel', temperatureK: 800 + C, pressureBar: 1.05, moleFractions: { H2: 0.1, CO: 0.05, CO2: 0.2, H2O: 0.65 } },
  ],
};

const pem: HazardInput = {
  technology: 'pem',
  mode: 'power',
  nickelBearing: false,
  operatingTemperatureK: 70 + C,
  fuelPressureBar: 1.5,
  airPressureBar: 1.5,
  ambientTemperatureK: 25 + C,
  dcVoltage: { voltageV: 48, description: 'the stack voltage' },
  streams: [
    { id: 'hydrogen-inlet', name: 'dry hydrogen inlet', role: 'feed', temperatureK: 25 + C, pressureBar: 1.5, moleFractions: { H2: 1 } },
    { id: 'anode-outlet', name: 'anode outlet', role: 'outlet', temperatureK: 70 + C, pressureBar: 1.5, moleFractions: { H2: 0.792, H2O: 0.208 } },
    // Air with its 420 ppm CO2 (the dry-air preset): no hazard of its own.
    { id: 'air-inlet', name: 'air inlet', role: 'feed', side: 'air', temperatureK: 25 + C, pressureBar: 1.5, moleFractions: { N2: 0.78084, O2: 0.209476, Ar: 0.00934, CO2: 0.00042 } },
  ],
};

const electrolyser: HazardInput = {
  technology: 'pem',
  mode: 'electrolysis',
  nickelBearing: false,
  operatingTemperatureK: 60 + C,
  fuelPressureBar: 30,
  airPressureBar: 1.2,
  ambientTemperatureK: 25 + C,
  dcVoltage: { voltageV: 400, description: 'the stack voltage' },
  streams: [
    { id: 'hydrogen-product', name: 'hydrogen product', role: 'product', temperatureK: 60 + C, pressureBar: 30, moleFractions: { H2: 0.99, H2O: 0.0099, O2: 0.0001 } },
    { id: 'oxygen-product', name: 'oxygen product', role: 'product', temperatureK: 60 + C, pressureBar: 1.2, moleFractions: { O2: 0.8, H2O: 0.195, H2: 0.005 } },
  ],
};

const byId = (a: HazardAssessment): Map<string, Caution> => new Map(a.cautions.map((c) => [c.id, c]));
const standardIds = (c: Caution | undefined) => c?.standards.map((s) => s.id) ?? [];

describe('methane-fed solid oxide cell with a nickel anode', () => {
  const a = assessHazards(sofc);
  const c = byId(a);

  it('gives the CO, nickel carbonyl, flammable off-gas and hydrogen cautions with their sources', () => {
    expect(standardIds(c.get('carbon-monoxide'))).toEqual(expect.arrayContaining(['nfpa-853', 'iec-62282-3-100']));
    expect(standardIds(c.get('nickel-carbonyl-shutdown'))).toContain('iec-62282-3-100');
    expect(standardIds(c.get('offgas-oxidation'))).toContain('iec-62282-3-100');
    expect(standardIds(c.get('hydrogen-leak'))).toEqual(expect.arrayContaining(['nfpa-2', 'iso-tr-15916']));
    expect(standardIds(c.get('hydrogen-flame'))).toContain('nfpa-2');
    expect(standardIds(c.get('hydrogen-piping'))).toEqual(['asme-b31-12', 'cga-g-5-4']);
    expect(standardIds(c.get('hydrogen-vent'))).toContain('cga-g-5-5');
    expect(standardIds(c.get('flammable-area-classification'))).toContain('iec-60079-10-1');
  });

  it('states the numbers: 5 % CO is 50 000 ppm, 41.7 times the IDLH; the anode outlet at 800 °C is above the 400 °C AIT of hydrogen', () => {
    expect(c.get('carbon-monoxide')!.text).toMatch(/anode outlet 5 % CO \(50,000 ppm, 41\.7 times the IDLH/);
    expect(c.get('carbon-monoxide')!.severity).toBe('danger');
    expect(c.get('autoignition')!.text).toMatch(/Anode outlet at 800 °C, above the 400 °C autoignition temperature of hydrogen/);
    expect(c.get('offgas-oxidation')!.text).toMatch(/Anode outlet \(15 % combustibles: H2 10 %, CO 5 %; mixture LFL 5\.17 %/);
    expect(c.get('offgas-oxidation')!.triggeredBy).toEqual(['anode-outlet']);
  });

  it('runs hot, so no carbonyl forms in operation, and nothing here is an electrolyser, oxygen or ammonia caution', () => {
    for (const id of ['nickel-carbonyl-in-operation', 'electrolysis-gas-purity', 'oxygen-enriched', 'toxic-ammonia', 'caustic-electrolyte', 'stream-flammable']) {
      expect(c.has(id), id).toBe(false);
    }
  });

  it('shows the hazard data of the substances in its streams and of nickel carbonyl, which it can form', () => {
    expect(a.substances.map((s) => [s.species, s.presence])).toEqual([
      ['H2', 'in streams'],
      ['CO', 'in streams'],
      ['CH4', 'in streams'],
      ['Ni(CO)4', 'can form'],
      ['CO2', 'in streams'],
    ]);
  });
});

describe('pure-hydrogen PEM cell', () => {
  const c = byId(assessHazards(pem));

  it('gives only hydrogen-related cautions: no CO, no nickel carbonyl, nothing for the CO2 of the air, no pressure caution at 0.487 bar gauge (below 0.5 bar, Directive 2014/68/EU) and no electrical one at 48 V (below 120 V DC, IEC 61140:2016)', () => {
    expect([...c.keys()].sort()).toEqual(
      [
        'flammable-area-classification',
        'gas-detection-alarm',
        'hydrogen-flame',
        'hydrogen-leak',
        'hydrogen-piping',
        'hydrogen-vent',
        'offgas-oxidation',
      ].sort(),
    );
  });

  it('puts the anode purge through controlled oxidation or a designed vent, and classifies for IIC', () => {
    expect(c.get('offgas-oxidation')!.triggeredBy).toEqual(['anode-outlet']);
    // Hydrogen's lowest recorded AIT is 400 °C (Zabetakis 1965): T2 (300 °C), IEC 60079-0:2017.
    expect(c.get('flammable-area-classification')!.text).toMatch(/gas group IIC .*temperature class T2 or a more demanding one/s);
    expect(c.get('hydrogen-piping')!.text).toMatch(/dry hydrogen inlet 1\.5 bar H2 at 25 °C; anode outlet 1\.19 bar H2 at 70 °C/);
  });
});

describe('PEM electrolyser', () => {
  const c = byId(assessHazards(electrolyser));

  it('gives the oxygen-enriched and gas-purity cautions with their sources', () => {
    expect(standardIds(c.get('oxygen-enriched'))).toEqual(expect.arrayContaining(['cga-g-4-4', 'astm-g94', 'astm-g63']));
    expect(c.get('oxygen-enriched')!.text).toMatch(/oxygen product 80 % O2 at 1\.2 bar/);
    expect(standardIds(c.get('electrolysis-gas-purity'))).toContain('iso-22734');
    expect(c.get('electrolysis-gas-purity')!.text).toMatch(/flammable from about 4 % H2/);
  });

  it('finds 0.5 % H2 in the oxygen product below its flammable range (screen: too lean)', () => {
    const o2 = assessHazards(electrolyser).streams.find((s) => s.id === 'oxygen-product')!;
    expect(o2.insideFlammableRangeFinding).toBe('too lean');
    expect(c.has('stream-flammable')).toBe(false);
  });
});

describe('the assessment object and its text', () => {
  const a = assessHazards(sofc);

  it('is JSON-serialisable without loss', () => {
    expect(JSON.parse(JSON.stringify(a))).toEqual(a);
  });

  it('carries the standing notice, which defers to codes, the authority having jurisdiction and licensed practice', () => {
    expect(a.notice).toBe(HAZARD_NOTICE);
    expect(HAZARD_NOTICE).toMatch(/^Informational only/);
    expect(HAZARD_NOTICE).toMatch(/hazard and operability study/);
    expect(HAZARD_NOTICE).toMatch(/authority having jurisdiction/);
    expect(HAZARD_NOTICE).toMatch(/licensed professional practice/);
    expect(HAZARD_NOTICE).toMatch(/editions/);
  });

  it('states the method and its limits', () => {
    const text = a.method.map((m) => m.text).join(' ');
    expect(text).toMatch(/Le Chatelier/);
    expect(text).toMatch(/not reliable for the upper limit/);
    expect(text).toMatch(/does not apply to mixtures that already contain oxygen/);
    expect(text).toMatch(/inert-addition diagrams is not modelled/);
    expect(text).toMatch(/1 ppm/);
  });

  it('prints the notice first, then every caution with its standards, the streams, the data with sources and the method', () => {
    const t = formatHazardsText(a);
    const notice = t.indexOf('Informational only');
    expect(notice).toBeGreaterThan(0);
    expect(notice).toBeLessThan(t.indexOf('Cautions:'));
    for (const c of a.cautions) expect(t).toContain(`${c.title}  [${c.id}]`);
    expect(t).toMatch(/Standards: IEC 62282-3-100, edition 2\.0, 2019 \(Fuel cell technologies/);
    expect(t).toMatch(/anode-outlet +outlet +800 +1\.05 +15 +5\.17/);
    const flat = t.replace(/\s+/g, ' ');
    expect(flat).toMatch(/AIT °C 400 \(Zabetakis 1965, USBM Bulletin 627, from memory\)/);
    expect(flat).toMatch(/idlh ppm 2 \(NIOSH IDLH documentation 1994\)/);
    expect(t.indexOf('Method')).toBeGreaterThan(t.indexOf('Substances and sources'));
    for (const line of t.split('\n').filter((l) => !l.startsWith('-') && !/^[a-z-]+ +(feed|outlet|internal|product)/.test(l) && !l.startsWith('stream') && !/^-+ /.test(l))) {
      expect(line.length, line).toBeLessThanOrEqual(96);
    }
  });
});
