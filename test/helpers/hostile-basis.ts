/**
 * A design basis whose every free text is hostile: HTML, scripts that would set
 * `window.__pwned` or open a dialog if they ever ran, closing tags of the elements a page keeps
 * raw text in (</style>, </script>), template syntax of Nunjucks and Eleventy, and LaTeX
 * commands KaTeX would act on. Each field carries a marker of its own (`[title]`, `[client]`, ...)
 * so that a test can find every field's text in the page, in the PDF and in the issued document.
 *
 * The basis is the solid oxide demo project (projects/thistlemere-sofc-chp) with its document
 * fields, sign-off names, cell material notes, value justifications, mixture name and source,
 * assumption texts and reference citations replaced through the YAML document model (so the
 * quoting is the YAML library's, never ours). It still validates and calculates.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { isMap, isScalar, parseDocument, type Document } from 'yaml';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';

export const HOSTILE_SOURCE_PROJECT = 'thistlemere-sofc-chp';

/** The scripts of the payload: each sets window.__pwned or opens a dialog, if it ever runs. */
export const SCRIPT_PAYLOAD = '<script>window.__pwned = 1; alert("pwned")</script><img src=x onerror="window.__pwned = 2; alert(2)"><svg onload="window.__pwned = 3"></svg>';

/** Markup, closing tags of raw-text elements, template syntax and LaTeX, after a field marker. */
export function hostileText(marker: string): string {
  return [
    `[${marker}]`,
    SCRIPT_PAYLOAD,
    '<b>bold</b> <a href="javascript:window.__pwned=4">link</a> &amp; &lt;',
    '</style></script></title></textarea><!--',
    '{{ 7*7 }} {% raw %} {{ cellbasis }} {{ page.url }} {%- include "/etc/passwd" %} ${7*7}',
    '\\href{javascript:alert(1)}{x} $\\frac{1}{0}$ \\def\\x{y} \\input{/etc/passwd} $$\\htmlClass{pwn}{x}$$',
  ].join(' ');
}

/** Pieces of the payload a test looks for literally in rendered text. */
export const LITERAL_PIECES = ['<script>window.__pwned = 1; alert("pwned")</script>', '<img src=x onerror="window.__pwned = 2; alert(2)">', '</style></script>', '{{ 7*7 }}', '{% raw %}', '{{ cellbasis }}', '\\href{javascript:alert(1)}{x}', '$\\frac{1}{0}$', '\\def\\x{y}', '\\input{/etc/passwd}'];

/** The mixture name: a YAML key of its own (no newline, under 200 characters). */
export const HOSTILE_MIXTURE = '[mixture] <script>window.__pwned=5</script>{{ 7*7 }}\\input{x}$\\frac{1}{0}$</style>';

export interface HostileField {
  /** Path in the YAML document. */
  path: (string | number)[];
  /** One marker per paragraph of the field's text. */
  markers: string[];
}

/** The text fields replaced, each with its marker. */
export const HOSTILE_FIELDS: HostileField[] = [
  { path: ['document', 'title'], markers: ['title'] },
  { path: ['document', 'number'], markers: ['number'] },
  { path: ['document', 'client'], markers: ['client'] },
  { path: ['document', 'site'], markers: ['site'] },
  // Two paragraphs, as the demo's purpose has: the page keeps the demo's structure.
  { path: ['document', 'purpose'], markers: ['purpose', 'purpose-2'] },
  { path: ['document', 'scope'], markers: ['scope'] },
  { path: ['document', 'sign-off', 'prepared', 'name'], markers: ['prepared'] },
  { path: ['document', 'sign-off', 'checked', 'name'], markers: ['checked'] },
  { path: ['cell', 'fuel-electrode'], markers: ['fuel-electrode'] },
  { path: ['cell', 'air-electrode'], markers: ['air-electrode'] },
  { path: ['cell', 'electrolyte'], markers: ['electrolyte'] },
  { path: ['cell', 'ionic-transference-number', 'source'], markers: ['source-transference'] },
  { path: ['conditions', 'fuel-inlet-temperature', 'source'], markers: ['source-fuel-inlet'] },
  { path: ['operating-point', 'air-utilization', 'source'], markers: ['source-air-utilization'] },
  { path: ['mixtures', HOSTILE_MIXTURE, 'source'], markers: ['source-mixture'] },
  ...[0, 1, 2, 3, 4, 5].map((i) => ({ path: ['assumptions', i, 'text'], markers: [`assumption-A${i + 1}`] })),
  ...[0, 1, 2, 3, 4].map((i) => ({ path: ['references', i, 'citation'], markers: [`reference-R${i + 1}`] })),
];

/** Every paragraph of hostile text the basis holds, by marker (the mixture name not included). */
export function hostileParagraphs(variant = ''): Map<string, string> {
  return new Map(HOSTILE_FIELDS.flatMap((f) => f.markers.map((m) => [m, `${hostileText(m)}${variant}`] as const)));
}

function renameMixture(doc: Document, from: string, to: string): void {
  const mixtures = doc.get('mixtures', true);
  if (!isMap(mixtures)) throw new Error('the demo basis has no mixtures mapping');
  const pair = mixtures.items.find((p) => isScalar(p.key) && p.key.value === from);
  if (!pair || !isScalar(pair.key)) throw new Error(`the demo basis has no mixture ${from}`);
  pair.key.value = to;
  doc.setIn(['streams', 'fuel-electrode', 'composition'], to);
}

/** The demo solid oxide basis with every free text hostile, each followed by `variant` (to tell revisions apart). */
export function hostileBasisText(variant = ''): string {
  const doc = parseDocument(readFileSync(join(PACKAGE_ROOT, 'projects', HOSTILE_SOURCE_PROJECT, 'basis.yaml'), 'utf8'));
  renameMixture(doc, 'site-gas', HOSTILE_MIXTURE);
  const paragraphs = hostileParagraphs(variant);
  for (const { path, markers } of HOSTILE_FIELDS) {
    if (!doc.hasIn(path)) throw new Error(`the demo basis has no ${path.join('.')}`);
    doc.setIn(path, markers.map((m) => paragraphs.get(m)!).join('\n\n'));
  }
  // The fuel-electrode note no longer says Ni-YSZ: keep the nickel anode it described.
  doc.setIn(['cell', 'nickel-bearing'], true);
  return doc.toString({ lineWidth: 0 });
}
