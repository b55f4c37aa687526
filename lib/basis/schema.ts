/**
 * The shape of a design-basis YAML file (projects/<id>/basis.yaml): every section and key, its
 * type and what it means. The loader checks files against it and the JSON Schema for editors
 * (schema/design-basis.schema.json, `cellbasis schema`) is generated from it, so the two cannot
 * drift. Keys are kebab-case plain English; every dimensional value is text with its unit.
 * Which keys each technology and mode needs, and every physical limit, are checked after this
 * shape by the read-*.ts modules.
 */
import { z } from 'zod';
import { MODES, TECHNOLOGY_NAMES } from '../electrochem/technologies.ts';
import { DEGRADED_QUANTITIES } from './types.ts';
import { choice, composition, describeValue, flag, fraction, isoDate, number, quantity, speciesFractions, strict, text } from './schema-parts.ts';

/**
 * Keys of `document:` that bases written for earlier versions carry: the issued revisions
 * (projects/<id>/issued/) decide the revision and its status now, so a basis that still states
 * them is refused at the key, with what to do (load.ts accepts them only in revisions issued
 * before, whose manifest they must match).
 */
export const RETIRED_DOCUMENT_KEYS: Readonly<Record<string, string>> = {
  revision:
    'the revision is no longer written in the basis: the issued revisions number it (cellbasis issue), and the working basis shows itself as the draft of the next one; delete this line',
  status:
    'the status is no longer written in the basis: a revision takes its status when it is issued (cellbasis issue --status), and the working basis is always the draft; delete this line',
};

const signatory = (role: string) =>
  strict(
    {
      name: text(`who ${role} the document`),
      date: isoDate('when, YYYY-MM-DD').optional(),
    },
    `the person who ${role} the document`,
  );

const documentSection = strict(
  {
    title: text('document title, e.g. "250 kW solid oxide CHP module, stack design basis"'),
    number: text('document number, e.g. HLX-DB-1042'),
    client: text('the client (invented names in demos)'),
    site: text('the site'),
    paper: choice(['A4', 'Letter'] as const, 'paper size of the printed document (default A4)').optional(),
    purpose: text('why this design basis exists'),
    scope: text('what it covers and what it leaves out'),
    'sign-off': strict(
      {
        prepared: signatory('prepared'),
        checked: signatory('checked').optional(),
        approved: signatory('approved').optional(),
      },
      'who prepared, checked and approved the document, with dates',
    ),
  },
  'document control: title, number, client, site, purpose, scope, sign-off (the revision and its status come from the issued revisions)',
  RETIRED_DOCUMENT_KEYS,
);

const cellSection = strict(
  {
    technology: choice(TECHNOLOGY_NAMES, 'cell technology (phosphoric-acid is read as ht-pem)'),
    mode: choice(MODES, 'power (fuel cell) or electrolysis; must be a mode of the technology'),
    'fuel-electrode': text('fuel-electrode material (free text), e.g. Ni-YSZ cermet').optional(),
    'air-electrode': text('air-electrode material (free text), e.g. LSM-YSZ').optional(),
    electrolyte: text('electrolyte material (free text), e.g. 8YSZ').optional(),
    'nickel-bearing': flag('whether the fuel electrode contains nickel; when omitted, read from the fuel-electrode text (Ni, nickel)').optional(),
    'ionic-transference-number': fraction(
      'ionic transference number t_ion of the electrolyte, in (0, 1]; open-circuit voltage = t_ion × Nernst voltage (default 1)',
    ).optional(),
    'crossover-allowance': quantity('voltage', 'voltage subtracted from the open-circuit voltage for gas crossover and leakage, e.g. "10 mV" (default 0)').optional(),
    'koh-mass-fraction': fraction(
      'mass fraction of potassium hydroxide in the electrolyte of an alkaline cell, e.g. "30 %" (wt %); required for alkaline cells; sets the water activity (Balej 1985, 10.1 % to 50.2 %, 0 to 200 °C)',
    ).optional(),
  },
  'the cell: technology, mode and materials',
);

const conditionsSection = strict(
  {
    'operating-temperature': quantity('temperature', 'stack operating temperature, e.g. "800 C"'),
    'temperature-sweep': strict(
      {
        from: quantity('temperature', 'lowest temperature of the sweep charts'),
        to: quantity('temperature', 'highest temperature of the sweep charts'),
      },
      'temperature range of the sweep charts (default: 150 K either side of the operating temperature, within the species data)',
    ).optional(),
    'fuel-inlet-temperature': quantity('temperature', 'fuel-electrode feed temperature at the stack inlet (default: operating temperature)').optional(),
    'air-inlet-temperature': quantity('temperature', 'air-electrode feed temperature at the stack inlet (default: operating temperature)').optional(),
    'allowed-air-temperature-rise': quantity('temperature-difference', 'allowed temperature rise of the air through the stack, e.g. "150 K" (default 100 K): the most an air-cooled stack\'s air may rise (stack less air inlet temperature); the rise a liquid-fed electrolyser\'s water loop is sized on').optional(),
    'fuel-electrode-pressure': quantity('pressure', 'fuel-electrode gas pressure, absolute unless the unit says gauge (barg, bar(g), psig, kPa(g))'),
    'air-electrode-pressure': quantity('pressure', 'air-electrode gas pressure, absolute unless the unit says gauge'),
    'ambient-temperature': quantity('temperature', 'ambient (cold-sink) temperature for the Carnot comparison (default 25 C)').optional(),
    'ambient-pressure': quantity('pressure', 'pressure of the ambient air, at which a relative humidity is stated and from which a blower draws unless its inlet pressure is given (default 1.01325 bar, the standard atmosphere at sea level, ISO 2533)').optional(),
  },
  'temperatures and pressures',
);

const mixture = strict(
  {
    source: text('where the composition comes from: a reference id or a justification'),
    composition: speciesFractions('species and mole fractions; they must sum to 1 (within 0.5 %, then normalised)'),
  },
  'a composition defined by this project',
);

const PRE_REFORMING = 'none, { kind: equilibrium, temperature: "480 C" } or { kind: adiabatic, inlet-temperature: "520 C" }';

const preReforming = z
  .union(
    [
      z.literal('none', { error: `expected ${PRE_REFORMING}` }),
      strict({
        kind: choice(['equilibrium'] as const, 'equilibrium: the gas leaves the pre-reformer at chemical equilibrium at the given temperature, the reactor heated or cooled to hold it'),
        temperature: quantity('temperature', 'pre-reformer outlet temperature'),
      }),
      strict({
        kind: choice(['adiabatic'] as const, 'adiabatic: no heat crosses the pre-reformer wall; the gas leaves at chemical equilibrium at the temperature the energy balance gives'),
        'inlet-temperature': quantity('temperature', 'temperature of the steam and fuel mixture entering the pre-reformer'),
      }),
    ],
    { error: (issue) => `expected ${PRE_REFORMING}, got ${describeValue(issue.input)}` },
  )
  .meta({ description: `${PRE_REFORMING}: a pre-reformer ahead of the stack whose outlet gas is at chemical equilibrium, at a given temperature or adiabatic` });

const fuelStream = strict(
  {
    composition: composition('a mixture name, a preset name (hydrogen, natural-gas, biogas, steam, ...) or { species: mole fraction }'),
    source: text('where the composition comes from').optional(),
    'steam-to-carbon': number('mol of steam added per mol of combustible carbon of the dry fuel (power mode)', '2.5').optional(),
    'steam-per-mole-fuel': number('mol of steam added per mol of dry fuel, instead of steam-to-carbon (power mode)', '0.5').optional(),
    'pre-reforming': preReforming.optional(),
  },
  'feed of the fuel electrode: the fuel in power mode; steam (+ H2, CO2) in solid-oxide electrolysis',
);

const humidity = strict(
  {
    'dew-point': quantity('temperature', 'dew point of the air at the air-electrode pressure').optional(),
    'relative-humidity': fraction('relative humidity of the ambient air, e.g. "60 %", stated at the ambient pressure (conditions.ambient-pressure)').optional(),
    at: quantity('temperature', 'temperature at which the relative humidity is stated').optional(),
  },
  'humidity of humid-air: { dew-point: "15 C" } or { relative-humidity: "60 %", at: "25 C" }',
);

const airComposition = composition('a mixture name, a preset name (dry-air, humid-air, oxygen, steam, liquid-water) or { species: mole fraction }');

const cathodeLoop = strict(
  {
    'burner-air': strict(
      {
        composition: airComposition,
        source: text('where the composition comes from').optional(),
        humidity: humidity.optional(),
      },
      'the air the catalytic burner takes: dry-air, or humid-air with its humidity',
    ),
    'inlet-oxygen': fraction('O2 mole fraction of the cathode gas at the air-electrode inlet, e.g. { value: "9.4 %", source: R2 }; with the air utilization it fixes the burner air and the recycled share'),
  },
  'molten carbonate, power mode: the cathode gas made by the plant, the fuel-electrode off-gas burnt completely with burner air and mixed with a recycled share of the air-electrode exhaust (instead of composition)',
);

const airStream = strict(
  {
    composition: airComposition.optional(),
    source: text('where the composition comes from').optional(),
    humidity: humidity.optional(),
    'cathode-loop': cathodeLoop.optional(),
  },
  'feed of the air electrode: air or oxygen (power); sweep air, steam or liquid water (electrolysis); or, for a carbonate cell, the cathode-gas loop that makes it',
);

const streamsSection = strict(
  {
    'fuel-electrode': fuelStream.optional(),
    'air-electrode': airStream.optional(),
  },
  'the feeds of the two electrodes (which are needed depends on technology and mode)',
);

const operatingPointSection = strict(
  {
    'fuel-utilization': fraction('fraction of the fuel fed that reacts (power mode), in (0, 1)').optional(),
    'steam-conversion': fraction('fraction of the water fed that is split (electrolysis), in (0, 1)').optional(),
    'air-utilization': fraction('fraction of the oxygen fed that reacts (power mode), in (0, 1); or give air-ratio').optional(),
    'air-ratio': number('oxygen fed per oxygen consumed (power mode), above 1; or give air-utilization', '4').optional(),
    'sweep-ratio': number('electrolysis: sweep-gas moles per mole of O2 produced; omit for pure oxygen', '2').optional(),
    'current-density': quantity('current-density', 'current density, e.g. "0.4 A/cm2"'),
    'cell-voltage': quantity('voltage', 'cell voltage, e.g. "0.80 V"; or give area-specific-resistance').optional(),
    'area-specific-resistance': quantity('area-specific-resistance', 'area-specific resistance, e.g. "0.35 ohm cm2"; or give cell-voltage').optional(),
    'resistance-temperature-law': strict(
      {
        'activation-energy': quantity('molar-energy', 'activation energy E_a of the resistance, e.g. "0.8 eV" or "77 kJ/mol"'),
        'reference-temperature': quantity(
          'temperature',
          'temperature at which area-specific-resistance applies (default: the operating temperature; with cell-voltage the law scales the resistance implied at the operating temperature, so omit it)',
        ).optional(),
        source: text('where the activation energy comes from: a reference id or a justification'),
      },
      'Arrhenius law of the area-specific resistance, ASR(T) = ASR_ref exp[(E_a/R)(1/T − 1/T_ref)], used where the temperature changes (temperature sweep and sensitivity); without it the resistance is held constant there',
    ).optional(),
    'activation-loss': strict(
      {
        'tafel-slope': quantity('voltage', 'Tafel slope b, the activation loss per decade of current density, e.g. "65 mV" (per decade)'),
        'exchange-current-density': quantity('current-density', 'exchange current density i0 referred to the geometric (active) area, e.g. "1e-4 A/cm2"'),
        source: text('where the Tafel slope and exchange current density come from: a reference id or a justification'),
      },
      'activation (kinetic) loss of the electrodes, one symmetric Butler-Volmer term: eta_act = (b / ln 10) asinh(i / (2 i0)), which tends to b log10(i / i0) for i >> i0; it is subtracted from the local Nernst voltage with the ohmic loss in power mode and added in electrolysis; b and i0 are held at every temperature (no temperature law); without it the cell has the ohmic loss alone',
    ).optional(),
    degradation: strict(
      {
        rate: quantity('degradation-rate', 'loss per unit of operating time, e.g. "0.5 %/kh" (per cent per 1000 h)'),
        of: choice(
          DEGRADED_QUANTITIES,
          'what the rate applies to: cell-voltage, the cell voltage at a given current density (it falls in power mode, rises in electrolysis); area-specific-resistance, the resistance (it grows)',
        ),
        'operating-time': quantity('time', 'operating time at which the point stands, e.g. "40000 h" or "40 kh"; "0 h" is the beginning of life'),
      },
      'degradation over operating time, linear at a constant rate (common practice, no source): ASR(t) = ASR₀ (1 + r t), or V(t) = V₀ (1 − r t) in power mode and V₀ (1 + r t) in electrolysis at the same current density; the cell-voltage or area-specific-resistance the basis gives are the beginning-of-life values',
    ).optional(),
    'active-area': quantity('area', 'active area of one cell, e.g. "100 cm2"'),
    cells: number('number of cells (a positive whole number)', '1200').optional(),
    'target-power': quantity('power', 'net electric output (power mode) or electric input (electrolysis), e.g. "250 kW"').optional(),
    'target-hydrogen': quantity('mass-flow', 'hydrogen production (electrolysis), e.g. "500 kg/day"').optional(),
    'parasitic-load': fraction('fraction of the stack DC power the balance of plant draws (blowers, pumps, controls), in [0, 1) (default 0); a compressor of plant.hydrogen-compression is counted on its own').optional(),
    'power-conversion-efficiency': fraction(
      'efficiency of the power conversion between the stack DC and the plant AC: the inverter (power mode) or the rectifier (electrolysis), in (0, 1] (default 1: no conversion counted)',
    ).optional(),
  },
  'the operating point. Give cells, a target, or both; when both, the calculation checks that they agree within 2 % and reports where they do not',
);

const voltageWindow = strict(
  {
    from: quantity('voltage', 'lowest DC bus voltage, e.g. "600 V"'),
    to: quantity('voltage', 'highest DC bus voltage, e.g. "800 V"'),
  },
  'the DC bus voltage window: the stacks in series are the most whose string voltage at the design point lies in it',
);

const plantSection = strict(
  {
    electrical: strict(
      {
        'cells-per-stack': number('cells in one stack (a positive whole number; default: all cells in one stack)', '80').optional(),
        'stacks-in-series': number('stacks in series in one string (default: from dc-bus-window, else 1)', '4').optional(),
        'dc-bus-window': voltageWindow.optional(),
        'strings-in-parallel': number('strings in parallel on the DC bus (default: as many as the cells needed take)', '6').optional(),
      },
      'how the cells are connected: cells per stack, stacks in series in a string, strings in parallel on the DC bus',
    ).optional(),
    'feed-temperatures': strict(
      {
        fuel: quantity('temperature', 'temperature at which the fuel reaches the plant (default: the ambient temperature)').optional(),
        air: quantity('temperature', 'temperature at which air reaches the plant (default: the ambient temperature)').optional(),
        water: quantity('temperature', 'temperature of the feed water (default: the ambient temperature)').optional(),
      },
      'temperatures at which fuel, air and feed water reach the plant',
    ).optional(),
    'anode-recycle': strict(
      {
        ratio: fraction('share of the fuel-electrode off-gas returned to the fuel inlet, in (0, 1)'),
        tolerance: number('relative change of the recycled flow at which the loop counts as solved (default 1e-9)', '1e-9').optional(),
      },
      'power mode, cells that reform at the fuel electrode: part of the fuel-electrode off-gas returned to the fuel inlet; fuel-utilization is then per pass through the stack',
    ).optional(),
    'off-gas-oxidiser': strict(
      {
        oxidant: choice(['air-electrode-exhaust', 'fresh-air'] as const, 'what burns the fuel-electrode off-gas: the air-electrode exhaust, or fresh air'),
        'air-ratio': number('fresh air: oxygen fed per oxygen that complete combustion of the off-gas needs, above 1', '1.5').optional(),
        'material-limit': quantity('temperature', 'highest outlet temperature the oxidiser and the duct after it are designed for, e.g. "950 C"'),
      },
      'power mode: the burner of the fuel-electrode off-gas; its products at equilibrium at the adiabatic temperature',
    ).optional(),
    'heat-recovery': strict(
      {
        'exhaust-exit-temperature': quantity('temperature', 'temperature at which the exhaust leaves the heat recovery, e.g. "90 C"'),
        'stack-heat': choice(['recovered', 'rejected'] as const, "whether the heat the stack's own cooling removes counts as delivered heat (recovered) or is rejected to ambient (default rejected)").optional(),
        'minimum-approach': quantity('temperature-difference', "least temperature difference between the exhaust and a stream it heats (default 20 K, common practice)").optional(),
      },
      "power mode: the exhaust heats the plant's feeds first (steam, fuel, air, pre-reformer) and the rest is delivered as heat, down to the exit temperature",
    ).optional(),
    'air-blower': strict(
      {
        'isentropic-efficiency': fraction('isentropic efficiency of the blower, in (0, 1], e.g. "70 %"'),
        'inlet-pressure': quantity('pressure', 'pressure the air is drawn in at (default the ambient pressure, conditions.ambient-pressure)').optional(),
      },
      'power mode: the blower that raises the air from its inlet pressure to the air-electrode pressure (one adiabatic stage, ideal gas, species data); its power is reported beside the parasitic load, which it is part of',
    ).optional(),
    'heat-loss': fraction('heat lost to ambient from the hot equipment, as a share of the fuel LHV input (power) or of the stack DC input (electrolysis; the rectifier loss is dissipated apart) (default 0)').optional(),
    'heat-supply': choice(
      ['electric', 'external'] as const,
      'electrolysis: where the heat of the feed heaters, the evaporator and the stack below thermoneutral comes from: electric heaters (counted in the specific energy) or heat from outside the plant (default electric)',
    ).optional(),
    'hydrogen-compression': strict(
      {
        'delivery-pressure': quantity('pressure', 'pressure the hydrogen is delivered at, e.g. "30 bar"'),
        stages: number('compression stages, intercooled (a whole number from 1 to 10); or give maximum-stage-ratio and/or maximum-discharge-temperature', '2').optional(),
        'maximum-stage-ratio': number(
          'instead of stages: the highest pressure ratio one stage may have; the stages are the fewest that keep each at or below it, N = ⌈ln(p_delivery/p_inlet) / ln r_max⌉',
          '3',
        ).optional(),
        'maximum-discharge-temperature': quantity(
          'temperature',
          'the highest temperature a stage may discharge the gas at, e.g. "135 C": without stages, the stages are the fewest that keep every stage at or below it (and at or below maximum-stage-ratio where given); with stages given, a stage above it is a finding',
        ).optional(),
        'isentropic-efficiency': fraction('isentropic efficiency of each stage, in (0, 1], e.g. "75 %"'),
        'inlet-temperature': quantity('temperature', 'the product gas is cooled to this temperature and dried ahead of the first stage (default 40 C)').optional(),
        'intercooling-temperature': quantity('temperature', 'gas temperature after each intercooler and the after-cooler (default: the inlet temperature)').optional(),
      },
      'electrolysis: the hydrogen product cooled, dried and compressed in intercooled stages (ideal gas, species data)',
    ).optional(),
    recuperator: strict(
      {
        'minimum-approach': quantity('temperature-difference', 'least temperature difference between the hot outlets and the feeds anywhere in the exchanger, e.g. "25 K"'),
      },
      "electrolysis fed with steam: a counter-flow recuperator in which the stack's hot outlets (hydrogen product and oxygen side) heat the feed water from its supply temperature (liquid heating, evaporation, superheating) and the sweep gas towards the stack inlet; the water heater, evaporator, superheater and gas heaters supply only the rest",
    ).optional(),
  },
  'the plant around the stack: electrical layout, feed preparation, off-gas oxidiser, anode recycle, heat recovery, hydrogen compression, feed recuperator. Absent blocks are left out of the plant balance',
);

const sensitivitySection = strict(
  {
    temperature: quantity('temperature-difference', 'temperature step (default "25 K")').optional(),
    pressure: fraction('relative pressure step (default "10 %")').optional(),
    utilization: fraction('absolute step of fuel utilization or steam conversion (default 0.05)').optional(),
    'steam-to-carbon': number('absolute step of the steam-to-carbon ratio (default 0.5)', '0.5').optional(),
    'current-density': fraction('relative current-density step (default "10 %")').optional(),
  },
  'steps of the sensitivity study; the defaults (25 K, 10 %, 0.05, 0.5, 10 %) are common practice, no source',
);

const acceptance = strict(
  {
    reason: text('why the revision may be approved while this assumption is still open'),
    by: text('who accepted it, usually the approver'),
    date: isoDate('when, YYYY-MM-DD'),
  },
  'an open assumption accepted for approval: the reason, who accepted it and when (shown in the document)',
);

const assumption = strict({
  id: text('assumption id, e.g. A1'),
  text: text('the assumption'),
  open: flag('true when it still needs verification (listed as an open item)').optional(),
  reference: text('a reference id of `references`').optional(),
  concerns: z
    .array(text('a field of this basis, dotted, e.g. conditions.allowed-air-temperature-rise'))
    .meta({
      description:
        'the basis fields (or sections) whose values and results this assumption vouches for: a finding of the calculation at one of them names the assumption, and flags it when it is marked confirmed (open: false)',
    })
    .optional(),
  accepted: acceptance.optional(),
});

const reference = strict({
  id: text('reference id, e.g. R1'),
  citation: text('the full citation'),
});

/** A case id: the key of a case under `cases:`, also its name in the results and the document. */
const CASE_ID = /^[a-z][a-z0-9-]{0,39}$/;

/**
 * What a case may change: any value of conditions, streams and operating-point, written exactly as
 * in the base basis (every key optional); each key given replaces the base value whole.
 */
const caseOverrides = strict(
  {
    conditions: conditionsSection.partial().meta({ description: 'temperatures and pressures of this case' }).optional(),
    streams: strict(
      {
        'fuel-electrode': fuelStream.partial().meta({ description: 'keys of the fuel-electrode feed this case changes' }).optional(),
        'air-electrode': airStream.partial().meta({ description: 'keys of the air-electrode feed this case changes' }).optional(),
      },
      'the feeds of this case',
    ).optional(),
    'operating-point': operatingPointSection
      .partial()
      .meta({
        description:
          'the operating point of this case: its load (current-density, or target-power or target-hydrogen on the cells of the sizing case), utilizations, resistance, degradation',
      })
      .optional(),
  },
  'the values of the base basis this case changes, written exactly as there, with units and sources; a key given replaces the base value whole (and the base value it excludes: cell-voltage or area-specific-resistance, air-utilization or air-ratio, steam-to-carbon or steam-per-mole-fuel, a load)',
);

const operatingCase = strict(
  {
    title: text('what the case is, e.g. "Minimum turndown, 30 % load"'),
    purpose: text('what it governs or checks, e.g. "the least fuel flow and the hottest cell voltage the controls must hold"'),
    sizing: flag('true for the one case that fixes the hardware (cell count, active area, resistance); without one, the base values do').optional(),
    overrides: caseOverrides.optional(),
  },
  'an operating case: the base basis with its overrides',
);

const casesSection = z
  .record(
    z.string().regex(CASE_ID, {
      error: (issue) => `a case id is lower-case letters, digits and hyphens, starting with a letter, at most 40 characters (such as end-of-life), got ${describeValue(issue.input)}`,
    }),
    operatingCase,
  )
  .meta({
    description:
      'operating cases by id, in the order the document shows them: each is the base basis with its overrides; the sizing case fixes the hardware and every other case runs on it at its own load',
  });

export const basisSchema = strict(
  {
    document: documentSection,
    cell: cellSection,
    conditions: conditionsSection,
    mixtures: z.record(z.string(), mixture).meta({ description: 'named compositions defined by this project, e.g. site-natural-gas' }).optional(),
    streams: streamsSection.optional(),
    'operating-point': operatingPointSection,
    plant: plantSection.optional(),
    sensitivity: sensitivitySection.optional(),
    cases: casesSection.optional(),
    assumptions: z.array(assumption).meta({ description: 'assumptions, each with an id; open: true marks those still to verify' }).optional(),
    references: z.array(reference).meta({ description: 'references cited by id from sources and assumptions' }).optional(),
  },
  'A cellbasis design basis for a fuel-cell or electrolyser plant. Every dimensional value is text with its unit, e.g. "800 C", "1.2 bar".',
);
