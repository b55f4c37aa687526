// The results file is documented by schema/results.schema.json, generated from the zod schema:
// every scaffold's results validate against the committed file (ajv, JSON Schema draft 7), and
// the committed file equals the generated one.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Ajv } from 'ajv';
import { calculate } from '../../lib/plant/calculate.ts';
import { resultsJsonSchemaText, RESULTS_SCHEMA_FILE } from '../../lib/plant/results-json-schema.ts';
import { scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { basisFrom } from './helpers.ts';

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

  it('a results object with a wrong unit-bearing field fails the schema', () => {
    const results = JSON.parse(JSON.stringify(calculate(basisFrom('pem', 'power'))));
    results.headline.cellVoltage_V = '0.7 V';
    expect(validate(results)).toBe(false);
  });
});
