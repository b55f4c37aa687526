// User text reaches the page only as escaped text: a basis whose title, number, client, purpose,
// assumptions and references carry markup, template syntax and LaTeX renders all of it inert,
// and the one unescaped channel, the `trusted` filter, refuses anything lib/report did not make.
import { describe, expect, it } from 'vitest';
import { renderDocumentHtml } from '../../lib/publish/render.ts';
import { nunjucksEnvironment } from '../../lib/publish/nunjucks-env.ts';
import { trustedHtml } from '../../lib/report/trusted-html.ts';
import { jsonForScript } from '../../lib/report/charts/json-script.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

const HOSTILE = '<script>alert(1)</script> {{ 7*7 }} \\href{x}{y} $\\def\\x{1}$';

function hostileYaml(yaml: string): string {
  const q = (s: string) => JSON.stringify(s);
  return yaml
    .replace(/^ {2}title: .*$/m, `  title: ${q(HOSTILE)}`)
    .replace(/^ {2}number: .*$/m, `  number: ${q('DB-1</style><script>alert(3)</script>')}`)
    .replace(/^ {2}client: .*$/m, `  client: ${q('"><img src=x onerror=alert(2)>')}`)
    .replace(/^ {4}Fix the stack operating point.*$/m, `    ${HOSTILE.replace('\\', '\\')}`)
    .replace(/text: The stack runs isothermal at the operating temperature\./, `text: ${q(`A1 ${HOSTILE}`)}`)
    .replace(/citation: "[^"]*"/, `citation: ${q('</script><script>alert(4)</script>')}`);
}

describe('a basis full of markup, template syntax and LaTeX', () => {
  const c = scaffoldCase('solid-oxide', 'power', hostileYaml);
  const html = renderDocumentHtml({ basis: c.basis, results: c.results, revision: { kind: 'draft', revision: 'A', lastIssued: null, date: '2026-11-30' }, history: [] }, { assetBase: 'assets/' });

  it('loads as a valid basis carrying the text', () => {
    expect(c.basis.document.title).toBe(HOSTILE);
  });

  it('shows the text escaped, never as markup', () => {
    expect(html).not.toContain('<script>alert(');
    expect(html).not.toContain('<img src=x');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('&quot;&gt;&lt;img src=x onerror=alert(2)&gt;');
  });

  it('does not evaluate template syntax in user text', () => {
    expect(html).toContain('{{ 7*7 }}');
    expect(html).not.toMatch(/49 &#92;href/);
  });

  it('never hands user text to KaTeX: its LaTeX stays plain text, and no link is made', () => {
    expect(html).toContain('&#92;href{x}{y}');
    expect(html).not.toMatch(/<a[^>]*href="x"/);
    expect(html).not.toContain('katex-error');
  });

  it('has only the script elements of the page itself: chart data and the two asset scripts', () => {
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    for (const tag of scripts) expect(tag).toMatch(/^<script (type="application\/json" class="chart-spec" data-canvas="fig-[a-z-]+-canvas"|src="assets\/(chart\.umd\.min|charts)\.js")>$/);
  });

  it('writes the number into the print footer as an escaped CSS string', () => {
    const style = /<style>([\s\S]*?)<\/style>/.exec(html)![1]!;
    expect(style).not.toContain('<');
    expect(style).toContain('\\3c ');
  });
});

describe('the trusted filter', () => {
  const env = nunjucksEnvironment();
  it('inserts HTML made by lib/report unescaped', () => {
    expect(env.renderString('{{ v | trusted }}', { v: trustedHtml('<b>ok</b>') })).toBe('<b>ok</b>');
  });
  it('refuses a plain string, so user text can never be inserted unescaped', () => {
    expect(() => env.renderString('{{ v | trusted }}', { v: '<b>user</b>' })).toThrow(/only HTML made by lib\/report/);
  });
  it('escapes everything else', () => {
    expect(env.renderString('{{ v }}', { v: '<b>x</b>' })).toBe('&lt;b&gt;x&lt;/b&gt;');
  });
});

it('chart JSON cannot close its script element', () => {
  const json = jsonForScript({ label: '</script><script>alert(5)</script>', amp: '&', ls: '\u2028' }).html;
  expect(json).not.toMatch(/[<>&\u2028]/);
  expect(JSON.parse(json)).toEqual({ label: '</script><script>alert(5)</script>', amp: '&', ls: '\u2028' });
});
