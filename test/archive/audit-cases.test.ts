// An issued revision's audit with recalculation (audit --recalculate) recalculates every operating
// case: the issued results are compared with a recalculation field by field, the cases and the
// envelope among them, so a case whose issued number is not what its basis gives is reported at
// its path, and a genuine revision passes.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { calculationProblems } from '../../lib/archive/audit-calculation.ts';

const BASIS = readFileSync(new URL('../../projects/thistlemere-sofc-chp/basis.yaml', import.meta.url));

describe('audit of a basis with cases', () => {
  const genuine = calculationProblems(BASIS, undefined, 'projects/thistlemere-sofc-chp/issued/A', 'thistlemere-sofc-chp', null, true);
  it('loads the issued basis with its cases', () => {
    expect(genuine.problems).toEqual([]);
    expect(genuine.basis!.cases.map((c) => c.id)).toEqual(['rated', 'turndown', 'end-of-life', 'winter-gas']);
  });

  it('passes results that a recalculation gives, and reports a tampered case and envelope value at their paths', async () => {
    const { calculate } = await import('../../lib/plant/calculate.ts');
    const results = JSON.parse(JSON.stringify(calculate(genuine.basis!)));
    expect(calculationProblems(BASIS, results, 'projects/thistlemere-sofc-chp/issued/A', 'thistlemere-sofc-chp', null, true).problems).toEqual([]);
    const k = results.cases.findIndex((c: { id: string }) => c.id === 'end-of-life');
    results.cases[k].headline.cellVoltage_V *= 1.01;
    const e = results.envelope.findIndex((r: { id: string }) => r.id === 'dc-current');
    results.envelope[e].case = 'rated';
    const { problems } = calculationProblems(BASIS, results, 'projects/thistlemere-sofc-chp/issued/A', 'thistlemere-sofc-chp', null, true);
    expect(problems).toHaveLength(1);
    const text = JSON.stringify(problems[0]);
    expect(text).toContain('in 2 fields');
    expect(text).toContain(`cases[${k}].headline.cellVoltage_V`);
    expect(text).toContain(`envelope[${e}].case`);
  });
});
