// Knowledge written once (issue 22.3, DEVELOPERS.md "Written once"): 0 °C in kelvin is read from the
// unit table (lib/core/data/units.yaml, ZERO_CELSIUS_K of lib/core/units.ts), never written as a
// literal 273.15 in code, and a temperature is written "<K> K (<°C> °C)" by lib/core/temperature-text.ts
// alone. Read with a real parser (sources.ts), so a comment quoting 273.15 K is no offence.
import { describe, expect, it } from 'vitest';
import { parseFile, parseSource, sourceFiles, walk, type Node } from './sources.ts';

const ZERO_CELSIUS = 273.15;
const TEMPERATURE_TEXT = 'lib/core/temperature-text.ts';

/** Lines of a module's code holding the number 273.15. */
function celsiusLiterals(program: Node): number[] {
  const lines: number[] = [];
  walk(program, (node) => {
    if (node.type === 'NumericLiteral' && node.value === ZERO_CELSIUS) lines.push(node.loc!.start.line);
  });
  return lines;
}

/** Lines of a module's template literals that write a kelvin value followed by its Celsius value in parentheses: `${k} K (${c} °C)`. */
function kelvinCelsiusTemplates(program: Node): number[] {
  const lines: number[] = [];
  walk(program, (node) => {
    if (node.type !== 'TemplateLiteral') return;
    const text = (node.quasis as Node[]).map((q) => (q.value as { cooked: string }).cooked).join('\u0000');
    if (/ K \(\u0000[^\u0000]*°C\)/.test(text)) lines.push(node.loc!.start.line);
  });
  return lines;
}

describe('knowledge written once in lib/', () => {
  const programs = sourceFiles('lib').map((file) => ({ file, program: parseFile(file) }));

  it('reads 0 °C in kelvin from the unit table: no literal 273.15 in code', () => {
    const found = programs.flatMap(({ file, program }) => celsiusLiterals(program).map((line) => `${file}:${line}`));
    if (found.length > 0) console.log(`literal 273.15 (use ZERO_CELSIUS_K of lib/core/units.ts, or kelvinWithCelsius for text):\n${found.join('\n')}`);
    expect(found).toEqual([]);
  });

  it(`writes "K (°C)" in ${TEMPERATURE_TEXT} alone`, () => {
    const found = programs.filter(({ file }) => file !== TEMPERATURE_TEXT).flatMap(({ file, program }) => kelvinCelsiusTemplates(program).map((line) => `${file}:${line}`));
    expect(found).toEqual([]);
    expect(kelvinCelsiusTemplates(programs.find(({ file }) => file === TEMPERATURE_TEXT)!.program)).toHaveLength(1);
  });

  it('finds the literal and the template in code, not in comments or strings', () => {
    const source = "// 273.15 K\nconst a = t - 273.15;\nconst s = '273.15';\nconst u = `${k} K (${k - z} °C)`;\nconst v = `${k} K`;";
    expect(celsiusLiterals(parseSource(source, 'x.ts'))).toEqual([2]);
    expect(kelvinCelsiusTemplates(parseSource(source, 'x.ts'))).toEqual([4]);
  });
});
