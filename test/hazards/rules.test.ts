// Every caution rule triggered by a minimal input and not triggered by the nearest input that
// misses its condition. The thresholds the cases straddle come from the data: LFL of H2 4 % and
// CH4 5 % (ISO/TR 15916, Zabetakis 1965), lowest AIT of H2 400 °C (Zabetakis 1965), the nickel
// carbonyl temperature 200 °C (common practice), the hydrogen-attack screen 200 °C (API RP 941,
// from memory), oxygen-enriched above 23.5 % (29 CFR 1910.146), IDLHs of NIOSH (1994).
import { describe, expect, it } from 'vitest';
import { assessHazards } from '../../lib/hazards/assessment.ts';
import { citedStandards, rules } from '../../lib/hazards/rules.ts';
import { standards } from '../../lib/hazards/standards.ts';
import type { HazardInput, HazardStream } from '../../lib/hazards/types.ts';
import { ATM, bareHazardInput, C } from '../helpers/hazard-input.ts';

const base: HazardInput = bareHazardInput;

function stream(moleFractions: Record<string, number>, over: Partial<HazardStream> = {}): HazardStream {
  return { id: 'x', name: 'test stream', role: 'feed', temperatureK: 25 + C, pressureBar: ATM, moleFractions, ...over };
}

const withStream = (moleFractions: Record<string, number>, over: Partial<HazardStream> = {}, basis: Partial<HazardInput> = {}): HazardInput => ({
  ...base,
  ...basis,
  streams: [stream(moleFractions, over)],
});

const inAir = (fuel: Record<string, number>): Record<string, number> => {
  const rest = 1 - Object.values(fuel).reduce((a, b) => a + b, 0);
  return { ...fuel, O2: rest * 0.2095, N2: rest * 0.7905 };
};

const COSTREAM = { CO: 0.1, N2: 0.9 };
const H2STREAM = { H2: 0.5, N2: 0.5 };

/** Rule id → [input that triggers it, nearest input that does not]. */
const CASES: Record<string, [HazardInput, HazardInput]> = {
  'nickel-carbonyl-in-operation': [
    withStream(COSTREAM, {}, { nickelBearing: true, operatingTemperatureK: 150 + C }),
    withStream(COSTREAM, {}, { nickelBearing: true, operatingTemperatureK: 250 + C }),
  ],
  'nickel-carbonyl-shutdown': [withStream(COSTREAM, {}, { nickelBearing: true }), withStream(COSTREAM, {}, { nickelBearing: false })],
  'carbon-monoxide': [withStream({ CO: 0.001, N2: 0.999 }), withStream({ N2: 1 })],
  'stream-flammable': [withStream(inAir({ H2: 0.1 })), withStream(inAir({ H2: 0.02 }))],
  autoignition: [withStream(H2STREAM, { temperatureK: 450 + C }), withStream(H2STREAM, { temperatureK: 350 + C })],
  'offgas-oxidation': [withStream(H2STREAM, { role: 'outlet' }), withStream(H2STREAM, { role: 'product' })],
  'hot-surface-ignition': [withStream(H2STREAM, {}, { operatingTemperatureK: 450 + C }), withStream(H2STREAM, {}, { operatingTemperatureK: 350 + C })],
  'hydrogen-leak': [withStream(H2STREAM), withStream({ CH4: 0.5, N2: 0.5 })],
  'hydrogen-flame': [withStream(H2STREAM), withStream({ CH4: 0.5, N2: 0.5 })],
  'flammable-area-classification': [withStream({ CH4: 0.06, N2: 0.94 }), withStream({ CH4: 0.04, N2: 0.96 })],
  'gas-detection-alarm': [withStream({ CH4: 0.06, N2: 0.94 }), withStream({ CH4: 0.04, N2: 0.96 })],
  'hydrogen-piping': [withStream(H2STREAM), withStream({ CH4: 0.5, N2: 0.5 })],
  'hydrogen-hot-materials': [withStream(H2STREAM, { temperatureK: 250 + C }), withStream(H2STREAM, { temperatureK: 150 + C })],
  'hydrogen-vent': [withStream(H2STREAM), withStream({ CH4: 0.5, N2: 0.5 })],
  'oxygen-enriched': [withStream({ O2: 0.3, N2: 0.7 }), withStream({ O2: 0.2095, N2: 0.7905 })],
  'electrolysis-gas-purity': [{ ...base, mode: 'electrolysis' }, { ...base, mode: 'power' }],
  // NH3 counts from its lowest 8-hour limit, 25 ppm (NIOSH REL TWA, NIOSH IDLH documentation 1994): 20 ppm misses it.
  'toxic-ammonia': [withStream({ NH3: 0.001, N2: 0.999 }), withStream({ NH3: 0.00002, N2: 0.99998 })],
  'ammonia-fuel': [withStream({ NH3: 0.001, N2: 0.999 }), withStream({ N2: 1 })],
  'toxic-methanol': [withStream({ CH3OH: 0.001, N2: 0.999 }), withStream({ N2: 1 })],
  'toxic-hydrogen-sulfide': [withStream({ H2S: 0.00001, N2: 0.99999 }), withStream({ N2: 1 })],
  // CO2 counts from its lowest 8-hour limit, 5000 ppm (NIOSH REL and OSHA PEL, NIOSH Pocket Guide): 4200 ppm misses it.
  'toxic-carbon-dioxide': [withStream({ CO2: 0.01, N2: 0.99 }), withStream({ CO2: 0.0042, N2: 0.9958 })],
  'caustic-electrolyte': [{ ...base, technology: 'alkaline' }, { ...base, technology: 'pem' }],
  // Directive 2014/68/EU applies above 0.5 bar gauge (Article 1(1)): 0.6 bar gauge is in, 0.4 bar gauge out.
  'pressure-equipment': [{ ...base, fuelPressureBar: ATM + 0.6 }, { ...base, fuelPressureBar: ATM + 0.4 }],
  // Extra-low voltage ends at 120 V ripple-free DC (IEC 61140:2016): 121 V is above it, 120 V is not.
  'dc-voltage': [{ ...base, dcVoltage: { voltageV: 121, description: 'the stack voltage' } }, { ...base, dcVoltage: { voltageV: 120, description: 'the stack voltage' } }],
  'unassessed-species': [withStream({ SO2: 0.00001, N2: 0.99999 }), withStream({ N2: 1 })],
  // The plant's own streams, by their ids (lib/plant/hazard-streams.ts): the oxidiser's outlet, the compressed hydrogen.
  'oxidiser-hot-surfaces': [withStream({ CO2: 0.1, H2O: 0.2, N2: 0.7 }, { id: 'oxidiser-outlet', temperatureK: 900 + C }), withStream({ CO2: 0.1, H2O: 0.2, N2: 0.7 }, { id: 'exhaust', temperatureK: 900 + C })],
  'hydrogen-compression': [withStream({ H2: 1 }, { id: 'hydrogen-delivered', pressureBar: 200, role: 'product' }), withStream({ H2: 1 }, { id: 'fuel-outlet', pressureBar: 200, role: 'product' })],
};

const ids = (input: HazardInput) => assessHazards(input).cautions.map((c) => c.id);
const caution = (input: HazardInput, id: string) => assessHazards(input).cautions.find((c) => c.id === id)!;

describe('caution rules', () => {
  it('has a trigger and a non-trigger case for every rule of the table', () => {
    expect(Object.keys(CASES).sort()).toEqual(rules().map((r) => r.id).sort());
  });

  it('every standard of standards.yaml is cited by some rule, and each rule cites one in each mode', () => {
    const cited = new Set(rules().flatMap((r) => [...citedStandards(r, 'power'), ...citedStandards(r, 'electrolysis')]));
    expect([...standards().keys()].filter((id) => !cited.has(id))).toEqual([]);
    for (const r of rules()) for (const mode of ['power', 'electrolysis'] as const) expect(citedStandards(r, mode).length, `${r.id} ${mode}`).toBeGreaterThan(0);
  });

  it('cites fuel-cell standards for a fuel cell and ISO 22734 for an electrolyser', () => {
    const power = caution(withStream(H2STREAM), 'hydrogen-leak').standards.map((s) => s.id);
    const electrolysis = caution(withStream(H2STREAM, {}, { mode: 'electrolysis' }), 'hydrogen-leak').standards.map((s) => s.id);
    expect(power).toEqual(['iec-62282-3-300', 'nfpa-853', 'nfpa-2', 'iso-tr-15916']);
    expect(electrolysis).toEqual(['iso-22734', 'nfpa-2', 'iso-tr-15916']);
  });

  it('the bare basis (PEM power, no streams, atmospheric) triggers nothing', () => {
    expect(ids(base)).toEqual([]);
  });

  for (const [id, [yes, no]] of Object.entries(CASES)) {
    it(`${id}: triggered, and not triggered when its condition is missed`, () => {
      const c = caution(yes, id);
      expect(c, `${id} not triggered`).toBeDefined();
      expect(ids(no)).not.toContain(id);
      expect(c.text).not.toMatch(/[{}]|\[\[|\]\]/);
      expect(c.title).not.toMatch(/[{}]/);
      expect(c.text.length).toBeGreaterThan(100);
      expect(c.standards.length).toBeGreaterThan(0);
      for (const s of c.standards) expect(s.title.length).toBeGreaterThan(5);
    });
  }
});

describe('caution texts carry the computed numbers', () => {
  it('CO: the stream, its ppm and its multiple of the IDLH; danger at or above the IDLH, warning below', () => {
    const high = caution(withStream({ CO: 0.002, N2: 0.998 }), 'carbon-monoxide');
    expect(high.severity).toBe('danger');
    expect(high.text).toMatch(/test stream 0\.2 % CO \(2,000 ppm, 1\.67 times the IDLH of 1,200 ppm\)/);
    expect(high.text).toMatch(/diluted about 1\.67-fold/);
    const low = caution(withStream({ CO: 0.0005, N2: 0.9995 }), 'carbon-monoxide');
    expect(low.severity).toBe('warning');
    expect(low.text).toMatch(/500 ppm, 0\.417 times the IDLH/);
    expect(low.text).not.toMatch(/immediately dangerous/);
  });
  it('nickel carbonyl: Ni(CO)4 limits from the data (0.001 ppm, IDLH 2 ppm) and the purge temperature of 200 °C', () => {
    const a = assessHazards(withStream(COSTREAM, {}, { nickelBearing: true }));
    const c = a.cautions.find((x) => x.id === 'nickel-carbonyl-shutdown')!;
    expect(c.severity).toBe('danger');
    expect(c.text).toMatch(/0\.001 ppm TWA, IDLH 2 ppm/);
    expect(c.text).toMatch(/above about 200 °C/);
    expect(c.text).toMatch(/Never expose a cooled nickel anode or catalyst to CO/);
    expect(a.substances.find((s) => s.species === 'Ni(CO)4')?.presence).toBe('can form');
  });
  it('nickel carbonyl looks at fuel-side CO only: CO in an air-side exhaust does not meet the nickel', () => {
    const exhaust = withStream({ CO: 0.00002, O2: 0.1, N2: 0.89998 }, { side: 'air' }, { nickelBearing: true });
    expect(ids(exhaust)).toContain('carbon-monoxide');
    expect(ids(exhaust)).not.toContain('nickel-carbonyl-shutdown');
    expect(ids(withStream(COSTREAM, { side: 'fuel' }, { nickelBearing: true }))).toContain('nickel-carbonyl-shutdown');
  });
  it('autoignition: stream temperature, the lowest AIT and its source', () => {
    const c = caution(withStream(H2STREAM, { temperatureK: 450 + C }), 'autoignition');
    expect(c.text).toMatch(/^Test stream at 450 °C, above the 400 °C autoignition temperature of hydrogen \(lowest recorded value, Zabetakis 1965/);
  });
  it('detection alarm: 25 % of the LFL as combustibles in air and as the gas itself', () => {
    // 6 % CH4 in N2: LFL_mix 5 %, alarm 1.25 % CH4 in air; stream LFL 5/0.06 = 83.3 %, alarm 20.8 %.
    expect(caution(withStream({ CH4: 0.06, N2: 0.94 }), 'gas-detection-alarm').text).toMatch(/test stream: 1\.25 % combustibles in air \(20\.8 % of the gas itself in air\)/);
  });
  it('area classification: the most demanding gas group recorded, those without one, and the class below the lowest AIT', () => {
    const t = caution(withStream({ H2: 0.3, CO: 0.2, CH4: 0.1, N2: 0.4 }), 'flammable-area-classification').text;
    expect(t).toMatch(/gas group IIC \(the most demanding recorded here, for hydrogen and methane\)/);
    expect(t).toMatch(/no gas group is recorded here for carbon monoxide/);
    // Lowest AIT: hydrogen 400 °C (Zabetakis 1965), so T2 (300 °C); IEC 60079-0:2017 classes.
    expect(t).toMatch(/temperature class T2 or a more demanding one: its maximum surface temperature of 300 °C \(IEC 60079-0\) is below 400 °C, the lowest autoignition temperature recorded here for any of these gases \(hydrogen, Zabetakis 1965/);
    expect(caution(withStream({ H2S: 0.1, CH4: 0.5, N2: 0.4 }), 'flammable-area-classification').text).toMatch(/gas group IIB .*temperature class T3/s);
  });
  it('pressure: the highest absolute and gauge pressure and where it is', () => {
    const t = caution(withStream(H2STREAM, { pressureBar: 30, name: 'hydrogen product' }), 'pressure-equipment').text;
    expect(t).toMatch(/up to 30 bar absolute, 29 bar gauge \(above the standard atmosphere of 1\.01325 bar\), in hydrogen product/);
    expect(t).toMatch(/ASME BPVC Section VIII/);
    expect(t).toMatch(/2014\/68\/EU/);
  });
  it('hydrogen piping: partial pressure per stream and the highest', () => {
    expect(caution(withStream(H2STREAM, { pressureBar: 30 }), 'hydrogen-piping').text).toMatch(/test stream 15 bar H2 at 25 °C.*highest here: 15 bar/s);
  });
  it('electrolysis: names the streams that carry both gases when there are any', () => {
    const mixed = caution(withStream({ O2: 0.99, H2: 0.01 }, {}, { mode: 'electrolysis' }), 'electrolysis-gas-purity');
    expect(mixed.text).toMatch(/streams of this basis carrying both: test stream 1 % H2 with 99 % O2/);
    expect(mixed.triggeredBy).toEqual(['x']);
    expect(caution({ ...base, mode: 'electrolysis' }, 'electrolysis-gas-purity').text).not.toMatch(/carrying both/);
  });
  it('carbon dioxide: not raised by air (420 ppm CO2), raised from its 5000 ppm limit on, naming that limit', () => {
    expect(ids(withStream(inAir({ CO2: 0.00042 }), { side: 'air' }))).not.toContain('toxic-carbon-dioxide');
    const c = caution(withStream({ CO2: 0.05, N2: 0.95 }), 'toxic-carbon-dioxide');
    expect(c.text).toMatch(/^Carbon dioxide is present at or above its lowest 8-hour exposure limit of 5,000 ppm: test stream 5 % CO2 \(1\.25 times the IDLH\)/);
    expect(c.severity).toBe('warning');
  });
  it('toxic gases escalate to danger at or above their IDLH (NH3 300 ppm, NIOSH)', () => {
    expect(caution(withStream({ NH3: 0.0001, N2: 0.9999 }), 'toxic-ammonia').severity).toBe('warning');
    expect(caution(withStream({ NH3: 0.0003, N2: 0.9997 }), 'toxic-ammonia').severity).toBe('danger');
  });
  it('cautions come danger first, then warning, then caution', () => {
    const order = { danger: 0, warning: 1, caution: 2 };
    const sev = assessHazards(withStream({ H2: 0.3, CO: 0.1, N2: 0.6 }, { role: 'outlet', temperatureK: 800 + C }, { nickelBearing: true, fuelPressureBar: 2 })).cautions.map(
      (c) => order[c.severity],
    );
    expect(sev).toEqual([...sev].sort((a, b) => a - b));
  });
});

describe('input checks of the basis', () => {
  it('rejects duplicate stream ids, unknown roles and non-positive basis numbers', () => {
    expect(() => assessHazards({ ...base, streams: [stream({ N2: 1 }), stream({ N2: 1 })] })).toThrow(/stream id "x" is used twice/);
    expect(() => assessHazards(withStream({ N2: 1 }, { role: 'vent' as never }))).toThrow(/unknown role "vent"/);
    expect(() => assessHazards(withStream({ N2: 1 }, { side: 'cathode' as never }))).toThrow(/unknown side "cathode"/);
    expect(() => assessHazards({ ...base, fuelPressureBar: 0 })).toThrow(/fuelPressureBar must be a positive finite number/);
    expect(() => assessHazards({ ...base, technology: 'steam-engine' as never })).toThrow(/unknown technology "steam-engine"/);
  });
});

describe('ammonia: counted from a sourced exposure limit, and not from the N2 the basis treats as inert', () => {
  // The anode off-gas of a natural-gas SOFC: the equilibrium along the anode forms ppm of NH3 from
  // the 1.5 % N2 of the gas (1.76 ppm at the outlet of the Thistlemere demo). The lowest 8-hour
  // limit of NH3 is 25 ppm (NIOSH REL TWA and ACGIH TLV TWA, NIOSH IDLH documentation 1994).
  const feed: HazardStream = { id: 'gas', name: 'natural gas', role: 'feed', side: 'fuel', temperatureK: 15 + C, pressureBar: 1.12, moleFractions: { CH4: 0.985, N2: 0.015 } };
  const offGas = (nh3: number): HazardStream => ({
    id: 'off',
    name: 'anode off-gas',
    role: 'outlet',
    side: 'fuel',
    temperatureK: 750 + C,
    pressureBar: 1.12,
    moleFractions: { H2: 0.2, CO: 0.1, CO2: 0.2, H2O: 0.49, N2: 0.01 - nh3, NH3: nh3 },
  });
  const assess = (...streams: HazardStream[]) => assessHazards({ ...base, technology: 'solid-oxide', nickelBearing: true, operatingTemperatureK: 750 + C, streams });

  it('1.76 ppm NH3 formed from N2 in the anode off-gas raises no ammonia caution', () => {
    const ids = assess(feed, offGas(1.76e-6)).cautions.map((c) => c.id);
    expect(ids).not.toContain('toxic-ammonia');
    expect(ids).not.toContain('ammonia-fuel');
  });

  it('nor does 60 ppm formed from N2 (a pressurised anode), above the 25 ppm limit: no feed carries ammonia, its nitrogen is inert', () => {
    expect(assess(feed, offGas(60e-6)).cautions.map((c) => c.id)).not.toContain('toxic-ammonia');
  });

  it('where ammonia is fed, an off-gas at 60 ppm raises it, naming the 25 ppm limit; 20 ppm does not', () => {
    const ammoniaFeed: HazardStream = { ...feed, id: 'nh3', name: 'ammonia feed', moleFractions: { NH3: 1 } };
    const c = assess(ammoniaFeed, offGas(60e-6)).cautions.find((x) => x.id === 'toxic-ammonia')!;
    expect(c.text).toMatch(/at or above its lowest 8-hour exposure limit of 25 ppm: ammonia feed 1,000,000 ppm NH3 \(3,330 times the IDLH\); anode off-gas 60 ppm NH3/);
    expect(c.severity).toBe('danger');
    expect(c.triggeredBy).toEqual(['nh3', 'off']);
    const low = assess({ ...ammoniaFeed, moleFractions: { NH3: 20e-6, N2: 1 - 20e-6 } }, offGas(1e-6));
    expect(low.cautions.map((x) => x.id)).not.toContain('toxic-ammonia');
  });
});

describe('pressure equipment: from the thresholds of the rules it paraphrases', () => {
  // Directive 2014/68/EU, Article 1(1): PS greater than 0.5 bar (gauge). ASME BPVC VIII-1, 2021,
  // 1.2(i): vessels not exceeding 15 psi are exempt; 15 psi × 6.894757 kPa/psi = 1.0342 bar.
  const at = (gauge_bar: number) => ids({ ...base, fuelPressureBar: ATM + gauge_bar });

  it('0.1 bar gauge (the SOFC demo runs at 1.12 bar absolute) raises nothing; 0.437 bar gauge (the PEM demo) neither', () => {
    expect(at(0.1)).not.toContain('pressure-equipment');
    expect(at(0.437)).not.toContain('pressure-equipment');
    expect(at(0.5)).not.toContain('pressure-equipment');
  });

  it('0.6 bar gauge is above the EU threshold and not above the ASME one; 2 bar gauge above both', () => {
    const mid = caution({ ...base, fuelPressureBar: ATM + 0.6 }, 'pressure-equipment').text;
    expect(mid).toMatch(/0\.6 bar gauge .*That is above the 0\.5 bar gauge above which Directive 2014\/68\/EU applies/s);
    expect(mid).toMatch(/not above the 15 psi \(1\.03 bar\) gauge up to which ASME BPVC Section VIII, Division 1 exempts a vessel/);
    const high = caution({ ...base, fuelPressureBar: ATM + 2 }, 'pressure-equipment').text;
    expect(high).toMatch(/and above the 15 psi \(1\.03 bar\) gauge/);
    expect(high).toMatch(/maximum allowable \(design\) pressure/);
  });
});

describe('electrical: DC above the extra-low-voltage limit', () => {
  // IEC 61140:2016: extra-low voltage is at most 120 V ripple-free DC; low voltage ends at 1 500 V DC
  // (IEC 60449 band II). The demo stacks: PEM backup 69.3 V, MCFC 336 V, PEM electrolyser 835 V,
  // SOFC module 5 020 V (the series voltage of all its cells).
  const at = (voltageV: number) => assessHazards({ ...base, dcVoltage: { voltageV, description: 'the stack voltage (the series voltage of its cells)' } });

  it('69.3 V raises nothing; 336 V raises a warning naming the voltage and the 120 V limit', () => {
    expect(at(69.3).cautions.map((c) => c.id)).not.toContain('dc-voltage');
    const c = at(335.72).cautions.find((x) => x.id === 'dc-voltage')!;
    expect(c.severity).toBe('warning');
    expect(c.text).toMatch(/^The stack voltage \(the series voltage of its cells\) is 336 V DC, above the extra-low-voltage limit of 120 V ripple-free DC/);
    expect(c.text).not.toMatch(/high voltage/);
    expect(c.standards.map((s) => s.id)).toEqual(['iec-62282-3-100', 'iec-61140', 'iec-60449', 'iec-60364-4-41', 'nfpa-70e']);
  });

  it('5 020 V is above the low-voltage band too and says so; an electrolyser cites ISO 22734', () => {
    expect(at(5024).cautions.find((x) => x.id === 'dc-voltage')!.text).toMatch(/above the 1,500 V DC where the low-voltage band ends: the DC system is high voltage/);
    const e = assessHazards({ ...base, mode: 'electrolysis', dcVoltage: { voltageV: 834.72, description: 'the stack voltage' } });
    expect(e.cautions.find((x) => x.id === 'dc-voltage')!.standards[0]!.id).toBe('iso-22734');
  });

  it('records the voltage it read in the assessment', () => {
    expect(at(335.72).basis).toMatchObject({ dcVoltage_V: 335.72, dcVoltageDescription: 'the stack voltage (the series voltage of its cells)' });
  });
});

describe('every standard cited carries its edition', () => {
  it('each entry of standards.yaml names a year, and each caution carries it', () => {
    for (const s of standards().values()) expect(s.edition, s.id).toMatch(/\b(19|20)\d\d\b/);
    const a = assessHazards(withStream({ H2: 0.3, CO: 0.1, N2: 0.6 }, { role: 'outlet', temperatureK: 800 + C, pressureBar: 3 }, { nickelBearing: true, dcVoltage: { voltageV: 400, description: 'the stack voltage' } }));
    for (const c of a.cautions) for (const s of c.standards) expect(s.edition, `${c.id} ${s.id}`).toMatch(/\b(19|20)\d\d\b/);
  });
});
