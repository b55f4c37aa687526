// The results file is documented by schema/results.schema.json, generated from the zod schema:
// every scaffold's results, and what `cellbasis calc --json` prints for every demo project,
// validate against the committed file (ajv, JSON Schema draft 7), and the committed file equals
// the generated one.
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { Ajv } from 'ajv';
import { calculate } from '../../lib/plant/calculate.ts';
import { resultsJsonSchemaText, RESULTS_SCHEMA_FILE } from '../../lib/plant/results-json-schema.ts';
import { scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';
import { run } from '../helpers/run-cli.ts';

const committed = readFileSync(new URL(`../../${RESULTS_SCHEMA_FILE}`, import.meta.url), 'utf8');

describe('results schema', () => {
  it('the committed schema is the generated one (run npx tsx scripts/write-schema.ts after changing it)', () => {
    expect(committed).toBe(resultsJsonSchemaText());
  });

  const validate = new Ajv({ allErrors: true, strict: false }).compile(JSON.parse(committed));
  it.each(scaffoldKinds())('results of the $technology $mode scaffold validate', ({ technology, mode }) => {
    const results = JSON.parse(JSON.stringify(calculate(basisFrom(technology, mode))));
    const ok = validate(results);
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  const root = fileURLToPath(new URL('../../', import.meta.url));
  const demos = readdirSync(new URL('../../projects/', import.meta.url), { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name).sort();
  it.each(demos)('cellbasis calc %s --json prints one complete results object that validates', async (id) => {
    const r = await run(['calc', id, '--json'], root);
    expect(r.code).toBe(0);
    const results = JSON.parse(r.out);
    const ok = validate(results);
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
    expect(results.project.id).toBe(id);
    // Complete: every headline value a review reads for its mode is a number, none left null.
    const power = results.technology.mode === 'power';
    const wanted = power
      ? ['meanNernst_V', 'outletNernst_V', 'cellVoltage_V', 'totalCurrent_A', 'netPower_W', 'electricalEfficiencyLhv', 'electricalEfficiencyHhv', 'thermodynamicLimitLhv', 'thermodynamicLimitHhv', 'stackHeat_W', 'airFlow_kg_per_h']
      : ['meanNernst_V', 'outletNernst_V', 'cellVoltage_V', 'totalCurrent_A', 'stackPower_W', 'stackHeat_W', 'hydrogenProduction_kg_per_h', 'hydrogenProduction_kg_per_day', 'specificEnergy_kWh_per_kg'];
    for (const key of wanted) expect(typeof results.headline[key], key).toBe('number');
  });

  it('a results object with a wrong unit-bearing field fails the schema', () => {
    const results = JSON.parse(JSON.stringify(calculate(basisFrom('pem', 'power'))));
    results.headline.cellVoltage_V = '0.7 V';
    expect(validate(results)).toBe(false);
  });
});
