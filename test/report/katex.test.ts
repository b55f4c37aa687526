// KaTeX at build time: our equations must parse (an invalid one fails the build, no error
// rendering), untrusted commands are refused, and an expression is rendered once however many
// pages use it.
import { describe, expect, it } from 'vitest';
import katex from 'katex';
import { katexOptions, renderTex, texCacheStats } from '../../lib/report/katex-render.ts';
import { EquationBook } from '../../lib/report/equation-book.ts';
import { methodSection } from '../../lib/report/method.ts';
import { documentView } from '../../lib/report/document.ts';
import { texSpecies } from '../../lib/report/tex.ts';
import { CASES, scaffoldCase } from '../helpers/scaffold-cases.ts';

describe('renderTex', () => {
  it('throws on an equation KaTeX cannot parse, naming it', () => {
    expect(() => renderTex('\\frac{1}{', true)).toThrow(/KaTeX cannot render the equation "\\frac\{1\}\{"/);
    expect(() => renderTex('\\notacommand x')).toThrow(/KaTeX cannot render/);
  });
  it('refuses untrusted commands instead of making links or classes', () => {
    expect(() => renderTex('\\href{https://example.org}{x}')).toThrow(/KaTeX cannot render/);
    expect(() => renderTex('\\htmlClass{x}{y}')).toThrow(/KaTeX cannot render/);
  });
  it('renders an expression once and serves it from the cache after that', () => {
    const tex = '\\frac{\\pi}{\\sqrt{e}}\\,\\mathrm{cached}';
    const before = texCacheStats().renders;
    const first = renderTex(tex, true);
    const second = renderTex(tex, true);
    expect(second).toBe(first);
    expect(texCacheStats().renders).toBe(before + 1);
    renderTex(tex, false);
    expect(texCacheStats().renders).toBe(before + 2);
  });
  it('renders an expression of a structure already learnt without KaTeX, as KaTeX would', () => {
    const first = renderTex(`E = ${Math.PI.toFixed(9)}\\,\\mathrm{V}`, true);
    const after = texCacheStats().renders;
    const second = renderTex(`E = ${Math.E.toFixed(9)}\\,\\mathrm{V}`, true);
    expect(texCacheStats().renders).toBe(after);
    expect(first.html).toContain('3.141592654');
    expect(second.html).toBe(katex.renderToString(`E = ${Math.E.toFixed(9)}\\,\\mathrm{V}`, katexOptions(true)));
  });
  it('writes species labels as formulas and refuses anything else', () => {
    expect(texSpecies('CH4')).toBe('\\mathrm{CH_{4}}');
    expect(texSpecies('H2O(L)')).toBe('\\mathrm{H_{2}O(l)}');
    expect(() => texSpecies('H2}\\href{x}')).toThrow(/not a species formula/);
  });
});

describe('documents share their rendering', () => {
  it('a second document of the same design renders no new expression', () => {
    const c = scaffoldCase('solid-oxide', 'power');
    const input = { basis: c.basis, results: c.results, revision: { kind: 'draft' as const, revision: 'A', lastIssued: null, date: null }, history: [] };
    documentView(input, { assetBase: '' });
    const after = texCacheStats().renders;
    documentView(input, { assetBase: '../../assets/' });
    expect(texCacheStats().renders).toBe(after);
  });
});

describe.each(CASES)('the method of the %s %s scaffold', (technology, mode) => {
  const c = scaffoldCase(technology, mode);
  const book = new EquationBook();
  const steps = methodSection(c.results, book, 5);
  const tex = steps.flatMap((s) => s.blocks).flatMap((b) => (b.kind === 'equation' ? [b.equation.html.html] : b.paragraph.flatMap((p) => (p.math ? [p.math.html] : []))));
  const text = steps.flatMap((s) => s.blocks).flatMap((b) => (b.kind === 'paragraph' ? b.paragraph.map((p) => p.text ?? '') : [])).join(' ');

  it('numbers its equations 1, 2, 3 ... and resolves every citation in its text', () => {
    const numbers = steps.flatMap((s) => s.blocks).flatMap((b) => (b.kind === 'equation' ? [b.equation.number] : []));
    expect(numbers).toEqual(numbers.map((_, i) => i + 1));
    expect(text).not.toMatch(/\{\{/);
  });
  it("derives the Nernst equation with this electrolyte's ion and half-reactions", () => {
    const ion = { oxide: 'O^{2-}', proton: 'H^{+}', carbonate: 'CO_3^{2-}', hydroxide: 'OH^{-}' }[c.results.technology.ion];
    expect(tex.some((h) => h.includes(`\\mathrm{${ion}}`))).toBe(true);
    expect(book.has('fuel-balance') && book.has('air-balance') && book.has('balance-sum') && book.has('gibbs-voltage') && book.has('nernst')).toBe(true);
    const nernst = book.get('nernst').html.html;
    const waterTerm = /p_\{\\mathrm\{H_\{2\}O\}/.test(nernst);
    // Gas-phase cells carry the water's pressure where the ion's reactions form it at an electrode;
    // liquid-water cells its activity p_H2O/p_w^sat (1 where the gas is saturated), issue 17 item 2.
    const liquid = c.results.technology.waterPhase === 'liquid';
    expect(waterTerm).toBe(liquid || c.results.technology.ion !== 'hydroxide');
    expect(nernst.includes('\\mathrm{sat}')).toBe(liquid);
    if (c.results.technology.ion === 'carbonate') expect(nernst).toContain('CO_{2}');
  });
  it('gives the temperature dependence from the NASA polynomials and ΔG° = ΔH° − TΔS°', () => {
    expect(book.has('nasa-h') && book.has('nasa-s') && book.has('reaction-properties') && book.has('standard-voltages')).toBe(true);
  });
});
