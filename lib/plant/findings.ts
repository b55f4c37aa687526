/**
 * Findings: what the calculation of a valid basis shows a reviewer must look at, each with a
 * stable code, a severity, the basis field it is located at (and any others it bears on), its
 * message with the numbers, and the assumptions of the basis that bear on those fields. Any layer
 * that calculates (the stack here, the plant around it) makes its findings with `finding` and the
 * layer that assembles the results passes them all through `withAssumptions` once.
 *
 * Severities:
 *   critical  the results contradict the basis itself: the stack as stated would be damaged
 *             (carbon deposits, the electrolyte dries out), or an assumption marked confirmed
 *             is disproved by the numbers;
 *   warning   the design point needs something the basis does not provide or show (heat the
 *             stated air or water cannot carry, cells short of the target, a share of the cell
 *             out of use);
 *   info      a fact of the design point to note (heat to supply below the thermoneutral voltage,
 *             an input that does not apply to this mode).
 *
 * An assumption bears on a finding when it is cited as the source of the field the finding is
 * located at (`{ value, source: A2 }`), or names that field, a related one or a section above
 * them under its `concerns`. An assumption marked confirmed
 * (open: false) that bears on a critical or warning finding gets a critical finding of its own,
 * `assumption-contradicted`, at its `open` flag.
 */
import { z } from 'zod';
import type { DesignBasis } from '../basis/types.ts';

const FINDING_SEVERITIES = ['critical', 'warning', 'info'] as const;
export type FindingSeverity = (typeof FINDING_SEVERITIES)[number];

export const findingSchema = z
  .object({
    code: z.string().describe('what kind of finding, kebab-case and stable (e.g. cooling-air-short)'),
    severity: z.enum(FINDING_SEVERITIES).describe('critical: the results contradict the basis; warning: the design point needs something the basis does not provide; info: a fact to note'),
    path: z.string().describe('the basis field it is located at, dotted as in the basis file'),
    related: z.array(z.string()).describe('other basis fields it bears on'),
    message: z.string(),
    assumptions: z.array(z.string()).describe('ids of the assumptions that bear on it (cited as the source of its field, or naming its fields under concerns)'),
  })
  .describe('a finding of the calculation for the reviewer');

export type Finding = z.infer<typeof findingSchema>;

const CONTRADICTED = 'assumption-contradicted';

/** A finding, its assumptions still to be linked by `withAssumptions`. */
export function finding(code: string, severity: FindingSeverity, path: string, message: string, related: readonly string[] = []): Finding {
  return { code, severity, path, related: [...related], message, assumptions: [] };
}

/** Whether `concern` names the field or a section that holds it. */
function covers(concern: string, field: string): boolean {
  return field === concern || field.startsWith(`${concern}.`);
}

/**
 * The findings with their assumptions linked and, for each confirmed assumption that bears on a
 * critical or warning finding, an `assumption-contradicted` finding; ordered by severity, then as
 * given. Earlier contradiction findings are made afresh, so a layer may call it again after
 * adding findings of its own.
 */
export function withAssumptions(findings: readonly Finding[], basis: Pick<DesignBasis, 'assumptions' | 'inputs'>): Finding[] {
  const own = findings.filter((f) => f.code !== CONTRADICTED);
  const linked = own.map((f) => {
    const fields = [f.path, ...f.related];
    const ids = basis.assumptions
      .filter(
        (a) =>
          a.concerns.some((c) => fields.some((field) => covers(c, field))) ||
          basis.inputs.some((input) => input.source?.trim() === a.id && (covers(f.path, input.path) || covers(input.path, f.path))),
      )
      .map((a) => a.id);
    return { ...f, assumptions: ids };
  });
  const flags: Finding[] = [];
  basis.assumptions.forEach((a, index) => {
    if (a.open) return;
    const against = linked.filter((f) => f.severity !== 'info' && f.assumptions.includes(a.id));
    if (!against.length) return;
    const what = against.map((f) => `${f.path}: ${f.message}`).join('; ');
    flags.push(
      finding(CONTRADICTED, 'critical', `assumptions.${index}.open`, `assumption ${a.id} is marked confirmed (open: false), but the results contradict it: ${what}`, against.map((f) => f.path)),
    );
    flags[flags.length - 1]!.assumptions = [a.id];
  });
  const rank = (f: Finding) => FINDING_SEVERITIES.indexOf(f.severity);
  return [...flags, ...linked].map((f, order) => ({ f, order })).sort((x, y) => rank(x.f) - rank(y.f) || x.order - y.order).map(({ f }) => f);
}

/**
 * The findings of the results as a reader prints them: the top-level ones (the sizing case's),
 * then those of every other case, each message beginning `case <id>: `.
 */
export function everyFinding(results: { findings: readonly Finding[]; cases?: readonly { id: string; sizing: boolean; findings: readonly Finding[] }[] }): Finding[] {
  const others = (results.cases ?? []).filter((c) => !c.sizing).flatMap((c) => c.findings.map((f) => ({ ...f, message: `case ${c.id}: ${f.message}` })));
  return [...results.findings, ...others];
}
