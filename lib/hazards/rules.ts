/**
 * The caution rule table (data/rules.yaml), checked at first use: every condition names a
 * predicate of predicates.ts, every standard an entry of standards.yaml (and every rule cites at
 * least one in each mode), every substance an entry of substances.yaml. Evaluating it renders each triggered rule's title and text from its
 * templates (template.ts) with the condition's values and the data values (data-values.ts).
 */
import { readDataFile } from '../core/data-file.ts';
import { z } from 'zod';
import { MODES, TECHNOLOGY_IDS, type Mode } from '../electrochem/technologies.ts';
import { dataValue } from './data-values.ts';
import { PREDICATES, type Match, type RuleContext, type Values } from './predicates.ts';
import { standardRef, standards } from './standards.ts';
import { findSubstance } from './substances.ts';
import { renderTemplate, sentence, type Resolver } from './template.ts';
import { SEVERITIES, STREAM_ROLES, type Caution } from './types.ts';

const SeverityId = z.enum(SEVERITIES);

const RawRule = z.strictObject({
  id: z.string().regex(/^[a-z0-9-]+$/),
  title: z.string(),
  when: z.string(),
  substance: z.string().optional(),
  technology: z.enum(TECHNOLOGY_IDS).optional(),
  roles: z.array(z.enum(STREAM_ROLES)).optional(),
  onlyWhereFed: z.boolean().optional(),
  severity: SeverityId,
  escalate: z.strictObject({ to: SeverityId, when: z.string() }).optional(),
  concerns: z.array(z.string()).optional(),
  each: z.string().optional(),
  text: z.string(),
  standards: z.array(z.string()),
  standardsByMode: z.strictObject({ power: z.array(z.string()).optional(), electrolysis: z.array(z.string()).optional() }).optional(),
});

export type Rule = z.infer<typeof RawRule>;

const WHERE = 'lib/hazards/data/rules.yaml';

function check(rule: Rule): void {
  const fail = (why: string) => {
    throw new Error(`${WHERE}: rule ${rule.id}: ${why}`);
  };
  if (!(rule.when in PREDICATES)) fail(`unknown condition "${rule.when}"`);
  if ((rule.when === 'substance-present' || rule.when === 'substance-at-exposure-limit') && !rule.substance) fail(`${rule.when} needs a substance`);
  if (rule.when === 'technology-is' && !rule.technology) fail('technology-is needs a technology');
  if (rule.onlyWhereFed && !rule.substance) fail('onlyWhereFed needs a substance');
  for (const label of [rule.substance, ...(rule.concerns ?? [])]) {
    if (label !== undefined && !findSubstance(label)) fail(`unknown substance "${label}"`);
  }
  for (const mode of MODES) {
    const ids = citedStandards(rule, mode);
    if (ids.length === 0) fail(`cites no standard in ${mode} mode`);
    for (const id of ids) if (!standards().has(id)) fail(`unknown standard "${id}"`);
  }
}

/** Standards a rule cites in a mode: its mode-specific ones first, then those of both modes. */
export function citedStandards(rule: Rule, mode: Mode): string[] {
  return [...(rule.standardsByMode?.[mode] ?? []), ...rule.standards];
}

let cache: Rule[] | undefined;

export function rules(): Rule[] {
  if (cache) return cache;
  const table = readDataFile(new URL('./data/rules.yaml', import.meta.url), z.array(RawRule));
  const ids = new Set<string>();
  for (const rule of table) {
    check(rule);
    if (ids.has(rule.id)) throw new Error(`${WHERE}: rule id ${rule.id} is used twice`);
    ids.add(rule.id);
  }
  cache = table;
  return cache;
}

function resolverOf(rule: Rule, ...layers: Values[]): Resolver {
  return (name) => {
    for (const layer of layers) if (name in layer) return layer[name];
    return dataValue(name, rule.substance);
  };
}

function render(rule: Rule, match: Match, mode: Mode): Caution {
  const where = `${WHERE}: rule ${rule.id}`;
  const lines = rule.each ? match.each.map((values) => renderTemplate(rule.each!, resolverOf(rule, values, match.values), `${where} (each)`)) : [];
  const resolve = resolverOf(rule, { each: lines.length ? lines.join('; ') : undefined }, match.values);
  return {
    id: rule.id,
    title: sentence(renderTemplate(rule.title, resolve, `${where} (title)`)),
    severity: match.escalate && rule.escalate ? rule.escalate.to : rule.severity,
    text: sentence(renderTemplate(rule.text, resolve, where)),
    standards: citedStandards(rule, mode).map(standardRef),
    triggeredBy: match.triggeredBy,
  };
}

export interface TriggeredRule {
  rule: Rule;
  caution: Caution;
}

/** Every rule whose condition holds, with its rendered caution, in the order of the table. */
export function evaluateRules(ctx: RuleContext): TriggeredRule[] {
  return rules().flatMap((rule) => {
    const match = PREDICATES[rule.when]!(ctx, { substance: rule.substance, technology: rule.technology, onlyWhereFed: rule.onlyWhereFed, ...(rule.roles ? { roles: rule.roles } : {}) });
    return match ? [{ rule, caution: render(rule, match, ctx.input.mode) }] : [];
  });
}
