// Every published value in lib/verification/reference-checks.yaml (NIST-JANAF, CODATA,
// textbook tables, facts of the trade; each entry names its source and says whether it is
// quoted from memory) must be reproduced within the tolerance the entry justifies.
import { describe, expect, it } from 'vitest';
import { referenceChecks, runCheck } from '../../lib/verification/checks.ts';

describe('reference checks against published values', () => {
  const checks = referenceChecks();

  it('the table holds at least 25 checks, each with a source, a tolerance and its reason', () => {
    expect(checks.length).toBeGreaterThanOrEqual(25);
    for (const c of checks) {
      expect(c.source, c.id).toMatch(/\w{5,}/);
      expect(c.why.length, c.id).toBeGreaterThanOrEqual(5);
      expect(c.tolerance, c.id).toBeGreaterThan(0);
      expect(typeof c.memory, c.id).toBe('boolean');
    }
    expect(new Set(checks.map((c) => c.id)).size).toBe(checks.length);
  });

  for (const check of checks) {
    it(`${check.id} ${check.what}: ${check.expected} ${check.unit} ± ${check.tolerance} (${check.source})`, () => {
      const result = runCheck(check);
      expect(Math.abs(result.computed - check.expected)).toBeLessThanOrEqual(check.tolerance);
      expect(result.pass).toBe(true);
    });
  }
});
