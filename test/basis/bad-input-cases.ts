// The bad-input corpus: each case is the base fixture (fixtures/sofc-power.yaml) with an edit,
// or a text of its own, and every diagnostic it must give, formatted `file:line:col: path:
// message` (so each asserts the exact message, the field path and the position).
import { BASE, edit } from '../helpers/basis-text.ts';

export interface BadCase {
  name: string;
  input: string | Uint8Array;
  errors: string[];
  warnings?: string[];
}

const bytes = (...parts: (string | number[])[]) =>
  Buffer.concat(parts.map((p) => (typeof p === 'string' ? Buffer.from(p, 'utf8') : Buffer.from(p))));

export const CASES: BadCase[] = [
  {
    name: 'tab in indentation',
    input: edit(BASE, ['  mode: power', '\tmode: power']),
    errors: [
      'projects/t/basis.yaml:16:1: a tab is used for indentation; YAML indents with spaces only',
    ],
  },
  {
    name: 'duplicate key',
    input: edit(BASE, ['  mode: power\n', '  mode: power\n  mode: power\n']),
    errors: [
      'projects/t/basis.yaml:17:3: duplicate key "mode" (first given at line 16); each key may appear once in a mapping',
    ],
  },
  {
    name: 'unclosed quote',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: "800 C']),
    errors: [
      'projects/t/basis.yaml:19:26: this quoted text has no closing "',
    ],
  },
  {
    name: 'bad indentation',
    input: edit(BASE, ['  mode: power', ' mode: power']),
    errors: [
      'projects/t/basis.yaml:16:2: the indentation here does not line up: keys of one mapping (and items of one list) must start at the same column',
    ],
  },
  {
    name: 'indented under a key that has a value',
    input: edit(BASE, ['  mode: power', '    mode: power']),
    errors: [
      'projects/t/basis.yaml:16:5: this line is indented under a key that already has a value on its own line; align it with the keys above it',
    ],
  },
  {
    name: 'invalid UTF-8 (a Latin-1 é)',
    input: bytes(BASE.slice(0, BASE.indexOf('Nowhere') + 4), [0xe9], BASE.slice(BASE.indexOf('Nowhere') + 5)),
    errors: [
      'projects/t/basis.yaml:9:13: byte 0xE9 is not valid UTF-8 (the file may be saved in Latin-1 or Windows-1252); save it as UTF-8',
    ],
  },
  {
    name: 'empty file',
    input: '',
    errors: [
      'projects/t/basis.yaml:1:1: the file is empty; start from `cellbasis new`',
    ],
  },
  {
    name: 'only blank lines',
    input: '\n  \n\n',
    errors: [
      'projects/t/basis.yaml:1:1: the file is empty; start from `cellbasis new`',
    ],
  },
  {
    name: 'only comments',
    input: '# nothing here yet\n',
    errors: [
      'projects/t/basis.yaml:1:1: the file holds only comments; start from `cellbasis new`',
    ],
  },
  {
    name: 'not a mapping',
    input: 'just some text\n',
    errors: [
      'projects/t/basis.yaml:1:1: a design basis is a mapping of sections (document:, cell:, conditions:, streams:, operating-point:, ...), got "just some text"',
    ],
  },
  {
    name: 'two documents',
    input: `${BASE}---\ncell: {}\n`,
    errors: [
      'projects/t/basis.yaml:42:1: the file holds more than one YAML document (a line "---" starts another); a design basis is one document',
    ],
  },
  {
    name: 'alias bomb',
    input: `a: &a [x, x, x, x, x, x, x, x]\nb: &b [*a, *a, *a, *a, *a, *a, *a, *a]\nc: &c [*b, *b, *b, *b, *b, *b, *b, *b]\nd: [*c, *c, *c, *c, *c, *c, *c, *c]\n`,
    errors: [
      'projects/t/basis.yaml:2:8: the aliases (*name) here expand to too much data; a design basis may expand at most 50 aliases',
    ],
  },
  {
    name: 'unknown key with did-you-mean',
    input: edit(BASE, ['operating-temperature:', 'operating-temprature:']),
    errors: [
      'projects/t/basis.yaml:19:3: conditions.operating-temprature: unknown key; did you mean "operating-temperature"?',
    ],
  },
  {
    name: 'unknown key far from any known one',
    input: edit(BASE, ['  mode: power\n', '  mode: power\n  colour: blue\n']),
    errors: [
      'projects/t/basis.yaml:17:3: cell.colour: unknown key; expected "technology", "mode", "fuel-electrode", "air-electrode", "electrolyte", "nickel-bearing", "ionic-transference-number" or "crossover-allowance"',
    ],
  },
  {
    name: 'unknown section',
    input: `${BASE}extras: { a: 1 }\n`,
    errors: [
      'projects/t/basis.yaml:42:1: extras: unknown key; expected "document", "cell", "conditions", "mixtures", "streams", "operating-point", "sensitivity", "assumptions" or "references"',
    ],
  },
  {
    name: 'missing required key',
    input: edit(BASE, ['  title: 250 kW solid oxide CHP module, stack design basis\n', '']),
    errors: [
      'projects/t/basis.yaml:3:1: document.title: this key is required but missing',
    ],
  },
  {
    name: 'empty value',
    input: edit(BASE, ['  number: TST-DB-0001', '  number:']),
    errors: [
      'projects/t/basis.yaml:5:10: document.number: expected text, got nothing (the key has no value)',
    ],
  },
  {
    name: 'text expected, number given',
    input: edit(BASE, ['revision: A', 'revision: 1']),
    errors: [
      'projects/t/basis.yaml:6:13: document.revision: expected text, got the number 1 (to keep it as text, quote it: "1")',
    ],
  },
  {
    name: 'wrong type: cells as text',
    input: edit(BASE, ['cells: 1200', 'cells: many']),
    errors: [
      'projects/t/basis.yaml:37:10: operating-point.cells: expected a number such as 1200, got "many"',
    ],
  },
  {
    name: 'wrong type: a list for a temperature',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: [800, C]']),
    errors: [
      'projects/t/basis.yaml:19:26: conditions.operating-temperature: expected a temperature such as "800 C" or "1073.15 K", got a list',
    ],
  },
  {
    name: 'a pressure where a temperature belongs',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: "1.2 bar"']),
    errors: [
      'projects/t/basis.yaml:19:26: conditions.operating-temperature: expected a temperature such as "800 C" or "1073.15 K", got "1.2 bar", which is a pressure',
    ],
  },
  {
    name: 'a temperature with no unit',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: 800']),
    errors: [
      'projects/t/basis.yaml:19:26: conditions.operating-temperature: expected a temperature such as "800 C" or "1073.15 K", got the bare number 800 (write the unit)',
    ],
  },
  {
    name: 'not a temperature at all',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: hot']),
    errors: [
      'projects/t/basis.yaml:19:26: conditions.operating-temperature: expected a temperature such as "800 C" or "1073.15 K", got "hot"',
    ],
  },
  {
    name: 'unknown unit',
    input: edit(BASE, ['current-density: "0.4 A/cm2"', 'current-density: "0.4 A/in2"']),
    errors: [
      'projects/t/basis.yaml:34:20: operating-point.current-density: expected a current density such as "0.5 A/cm2" or "500 mA/cm2" (units: A/m2, A/cm2, mA/cm2, kA/m2), got "0.4 A/in2" with unknown unit "A/in2"',
    ],
  },
  {
    name: 'temperature below absolute zero',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: "-300 C"']),
    errors: [
      'projects/t/basis.yaml:19:26: conditions.operating-temperature: -300 C is at or below absolute zero (-26.85 K)',
    ],
  },
  {
    name: 'negative absolute pressure',
    input: edit(BASE, ['fuel-electrode-pressure: "1.2 bar"', 'fuel-electrode-pressure: "-0.5 bar"']),
    errors: [
      'projects/t/basis.yaml:20:28: conditions.fuel-electrode-pressure: an absolute pressure must be above zero, got -0.5 bar (for a gauge pressure write barg or bar(g))',
    ],
  },
  {
    name: 'gauge pressure below vacuum',
    input: edit(BASE, ['air-electrode-pressure: "1.2 bar"', 'air-electrode-pressure: "-1.5 barg"']),
    errors: [
      'projects/t/basis.yaml:21:27: conditions.air-electrode-pressure: -1.5 barg is below vacuum: -0.48675 bar absolute (gauge pressures are referred to 1 atm = 1.01325 bar)',
    ],
  },
  {
    name: 'utilization 1.2',
    input: edit(BASE, ['fuel-utilization: 0.80', 'fuel-utilization: 1.2']),
    errors: [
      'projects/t/basis.yaml:32:21: operating-point.fuel-utilization: the fuel utilization lies strictly between 0 and 1, got 1.2',
    ],
  },
  {
    name: 'utilization 0',
    input: edit(BASE, ['fuel-utilization: 0.80', 'fuel-utilization: "0 %"']),
    errors: [
      'projects/t/basis.yaml:32:21: operating-point.fuel-utilization: the fuel utilization lies strictly between 0 and 1, got 0 %',
    ],
  },
  {
    name: 'composition summing to 0.9',
    input: edit(BASE, ['CH4: 0.93,', 'CH4: 0.83,']),
    errors: [
      'projects/t/basis.yaml:23:40: mixtures.site-gas.composition: the mole fractions sum to 0.9; they must sum to 1 (within 0.5 %)',
    ],
  },
  {
    name: 'unknown species with suggestion',
    input: edit(BASE, ['C2H6: 0.04', 'C2H7: 0.04']),
    errors: [
      'projects/t/basis.yaml:23:53: mixtures.site-gas.composition.C2H7: unknown species "C2H7"; did you mean "C2H2", "C2H4", "C2H6"? (cellbasis species --list shows every species)',
    ],
  },
  {
    name: 'mole fraction above 1',
    input: edit(BASE, ['composition: site-gas', 'composition: { H2: 1.5, H2O: -0.5 }']),
    errors: [
      'projects/t/basis.yaml:26:24: streams.fuel-electrode.composition.H2: a mole fraction lies between 0 and 1, got 1.5',
      'projects/t/basis.yaml:26:34: streams.fuel-electrode.composition.H2O: a mole fraction lies between 0 and 1, got -0.5',
    ],
  },
  {
    name: 'both cell-voltage and area-specific-resistance',
    input: edit(BASE, ['  cell-voltage: "0.80 V"\n', '  cell-voltage: "0.80 V"\n  area-specific-resistance: "0.35 ohm cm2"\n']),
    errors: [
      'projects/t/basis.yaml:36:3: operating-point.area-specific-resistance: give cell-voltage or area-specific-resistance, not both',
    ],
  },
  {
    name: 'neither cell-voltage nor area-specific-resistance',
    input: edit(BASE, ['  cell-voltage: "0.80 V"\n', '']),
    errors: [
      'projects/t/basis.yaml:31:1: operating-point.cell-voltage: give cell-voltage (e.g. "0.80 V") or area-specific-resistance (e.g. "0.35 ohm cm2")',
    ],
  },
  {
    name: 'both air-utilization and air-ratio',
    input: edit(BASE, ['  air-utilization: 0.25\n', '  air-utilization: 0.25\n  air-ratio: 4\n']),
    errors: [
      'projects/t/basis.yaml:34:3: operating-point.air-ratio: give air-utilization or air-ratio, not both',
    ],
  },
  {
    name: 'steam-to-carbon with a carbon-free fuel',
    input: edit(BASE, ['composition: site-gas', 'composition: hydrogen']),
    errors: [
      'projects/t/basis.yaml:27:22: streams.fuel-electrode.steam-to-carbon: steam-to-carbon counts steam per mol of combustible carbon, and hydrogen has none, so no steam would be added; to humidify a carbon-free fuel give steam-per-mole-fuel',
    ],
  },
  {
    name: 'mode the technology does not have',
    input: edit(BASE, ['technology: solid-oxide', 'technology: ht-pem'], ['mode: power', 'mode: electrolysis']),
    errors: [
      'projects/t/basis.yaml:16:9: cell.mode: ht-pem cells (high-temperature proton exchange membrane / phosphoric acid) run in "power" mode only, not electrolysis',
    ],
  },
  {
    name: 'technology misspelt',
    input: edit(BASE, ['technology: solid-oxide', 'technology: solid-oxyde']),
    errors: [
      'projects/t/basis.yaml:15:15: cell.technology: expected "solid-oxide", "proton-ceramic", "pem", "ht-pem", "alkaline", "molten-carbonate" or "phosphoric-acid", got "solid-oxyde"; did you mean "solid-oxide"?',
    ],
  },
  {
    name: 'temperature outside the species data',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: "7000 K"']),
    errors: [
      'projects/t/basis.yaml:19:26: conditions.operating-temperature: 7000 K is outside the range of the species data (of the feeds and the cell reaction): CH4 200 K to 6000 K; C2H6 200 K to 6000 K; C3H8 200 K to 6000 K; H2O 200 K to 6000 K',
    ],
    warnings: [
      'projects/t/basis.yaml:19:26: warning: conditions.operating-temperature: 7000 K is outside the typical range of solid-oxide cells, 873.15 K (600 °C) to 1273.15 K (1000 °C) (common practice, no source)',
    ],
  },
  {
    name: 'liquid water in a stream at 800 C',
    input: edit(BASE, ['composition: humid-air', 'composition: { "H2O(L)": 0.1, O2: 0.9 }'], ['    humidity: { dew-point: "15 C" }\n', '']),
    errors: [
      'projects/t/basis.yaml:29:20: streams.air-electrode.composition.H2O(L): H2O(L) has data only from 273.15 K to 600 K, but the air-electrode feed sees the operating temperature 1073.15 K (800 °C) (for steam write H2O)',
    ],
  },
  {
    name: 'undefined reference id',
    input: edit(BASE, ['reference: R1 }', 'reference: R7 }']),
    errors: [
      'projects/t/basis.yaml:39:63: assumptions[0].reference: R7 looks like a reference id, but references define no R7; defined: "R1"',
    ],
  },
  {
    name: 'undefined reference id in a sourced value',
    input: edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: { value: "800 C", source: R9 }']),
    errors: [
      'projects/t/basis.yaml:19:52: conditions.operating-temperature.source: R9 looks like a reference id, but references and assumptions define no R9; defined: "R1" and "A1"',
    ],
  },
  {
    name: 'bad date',
    input: edit(BASE, ['date: 2026-11-20', 'date: 2026-02-30']),
    errors: [
      'projects/t/basis.yaml:13:40: document.sign-off.prepared.date: expected a real date written YYYY-MM-DD, such as 2026-11-20, got "2026-02-30"',
    ],
  },
  {
    name: 'bad status',
    input: edit(BASE, ['status: draft', 'status: final']),
    errors: [
      'projects/t/basis.yaml:7:11: document.status: expected "draft", "issued for review", "issued for approval", "approved" or "superseded", got "final"',
    ],
  },
  {
    name: 'humid-air without humidity',
    input: edit(BASE, ['    humidity: { dew-point: "15 C" }\n', '']),
    errors: [
      'projects/t/basis.yaml:29:18: streams.air-electrode.composition: humid-air needs a humidity beside it: humidity: { dew-point: "15 C" } or { relative-humidity: "60 %", at: "25 C" }',
    ],
  },
  {
    name: 'humidity with a dry composition',
    input: edit(BASE, ['composition: humid-air', 'composition: dry-air']),
    errors: [
      'projects/t/basis.yaml:30:5: streams.air-electrode.humidity: humidity applies to composition humid-air only; this stream\'s composition is dry-air',
    ],
  },
  {
    name: 'dew point below the liquid-water data',
    input: edit(BASE, ['dew-point: "15 C"', 'dew-point: "-5 C"']),
    errors: [
      'projects/t/basis.yaml:30:28: streams.air-electrode.humidity.dew-point: the dew point must lie within the liquid-water data, 273.15 K (0 °C) to 600 K (326.85 °C), got -5 C',
    ],
  },
  {
    name: 'mixture named like a preset',
    input: edit(BASE, ['  site-gas: {', '  natural-gas: {'], ['composition: site-gas', 'composition: natural-gas']),
    errors: [
      'projects/t/basis.yaml:23:3: mixtures.natural-gas: "natural-gas" is the name of a preset; give this mixture its own name (e.g. site-natural-gas)',
    ],
  },
  {
    name: 'unknown mixture name',
    input: edit(BASE, ['composition: site-gas', 'composition: site-gaz']),
    errors: [
      'projects/t/basis.yaml:26:18: streams.fuel-electrode.composition: unknown mixture or preset "site-gaz"; did you mean "site-gas"? (presets: dry-air, humid-air, oxygen, hydrogen, steam, liquid-water, natural-gas, biogas; define your own under mixtures:)',
    ],
  },
  {
    name: 'steam-conversion in power mode',
    input: edit(BASE, ['fuel-utilization: 0.80', 'steam-conversion: 0.80']),
    errors: [
      'projects/t/basis.yaml:32:3: operating-point.steam-conversion: steam-conversion belongs to electrolysis; in power mode give fuel-utilization',
    ],
  },
  {
    name: 'cells not a whole number',
    input: edit(BASE, ['cells: 1200', 'cells: 12.5']),
    errors: [
      'projects/t/basis.yaml:37:10: operating-point.cells: the number of cells must be a positive whole number, got 12.5',
    ],
  },
  {
    name: 'transference number above 1',
    input: edit(BASE, ['  fuel-electrode: Ni-YSZ cermet\n', '  fuel-electrode: Ni-YSZ cermet\n  ionic-transference-number: 1.5\n']),
    errors: [
      'projects/t/basis.yaml:18:30: cell.ionic-transference-number: the ionic transference number lies in (0, 1], got 1.5',
    ],
  },
  {
    name: 'pem electrolysis with a fuel-electrode feed and no liquid water',
    input: edit(BASE, ['technology: solid-oxide', 'technology: pem'], ['mode: power', 'mode: electrolysis'], ['fuel-utilization: 0.80', 'steam-conversion: 0.05'], ['  air-utilization: 0.25\n', ''], ['operating-temperature: "800 C"', 'operating-temperature: "60 C"']),
    errors: [
      'projects/t/basis.yaml:25:3: streams.fuel-electrode: pem electrolysis takes no feed at the fuel-electrode (hydrogen forms there from the protons); remove streams.fuel-electrode',
      'projects/t/basis.yaml:29:18: streams.air-electrode.composition: pem electrolysis takes liquid water at the air-electrode, { "H2O(L)": 1 } (preset liquid-water), got humid-air (O2, Ar, CO2, N2, H2O)',
    ],
  },
  {
    name: 'several errors in one file',
    input: edit(BASE, ['status: draft', 'status: final'], ['operating-temperature: "800 C"', 'operating-temperature: hot'], ['fuel-utilization: 0.80', 'fuel-utilization: 1.2'], ['cells: 1200', 'cells: -3'], ['  mode: power\n', '  mode: power\n  colour: blue\n']),
    errors: [
      'projects/t/basis.yaml:7:11: document.status: expected "draft", "issued for review", "issued for approval", "approved" or "superseded", got "final"',
      'projects/t/basis.yaml:17:3: cell.colour: unknown key; expected "technology", "mode", "fuel-electrode", "air-electrode", "electrolyte", "nickel-bearing", "ionic-transference-number" or "crossover-allowance"',
      'projects/t/basis.yaml:20:26: conditions.operating-temperature: expected a temperature such as "800 C" or "1073.15 K", got "hot"',
      'projects/t/basis.yaml:33:21: operating-point.fuel-utilization: the fuel utilization lies strictly between 0 and 1, got 1.2',
      'projects/t/basis.yaml:38:10: operating-point.cells: the number of cells must be a positive whole number, got -3',
    ],
  },
];
