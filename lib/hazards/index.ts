/**
 * The hazards library: hazard data of substances (with sources), indicators per stream,
 * cautions that follow from the design basis (each citing its standards), the standing notice
 * and the readable terminal text. `assessHazards` is the entry point; `formatHazardsText` is what
 * the CLI prints.
 */
export { assessHazards } from './assessment.ts';
export { formatHazardsText } from './format-text.ts';
export { HAZARD_NOTICE, methodNotes } from './notice.ts';
export { leChatelier, type LimitShare } from './le-chatelier.ts';
export { effectiveLfl, mixtureLimits, flammableOnMixingWithAir, insideRangeScreen, limitingOxygen, stoichiometricOxygen } from './flammability.ts';
export { streamIndicators } from './indicators.ts';
export { allSubstances, findSubstance, substance, type Substance } from './substances.ts';
export { standards, standard, type Standard } from './standards.ts';
export { rules, type Rule } from './rules.ts';
export type * from './types.ts';
