// Every scaffold (each technology × supported mode) validates without errors or warnings, and
// against the committed JSON Schema, as does every demo basis in projects/; the committed schema
// is the one the zod schema generates.
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Ajv } from 'ajv';
import { parse } from 'yaml';
import { renderScaffold, scaffoldKinds, hasScaffold } from '../../lib/basis/scaffolds.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { formatDiagnostic } from '../../lib/basis/diagnostics.ts';
import { designBasisJsonSchema, designBasisJsonSchemaText, SCHEMA_FILE } from '../../lib/basis/json-schema.ts';
import { technologies } from '../../lib/electrochem/technologies.ts';
import { BASE, edit } from '../helpers/basis-text.ts';

const committed = readFileSync(new URL(`../../${SCHEMA_FILE}`, import.meta.url), 'utf8');
// "date" is a standard format; ajv leaves format checking to ajv-formats, which editors have built in.
const validate = new Ajv({ allErrors: true, strict: true, formats: { date: true } }).compile(JSON.parse(committed));

const PROJECTS = new URL('../../projects/', import.meta.url);
const demoIds = readdirSync(PROJECTS, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name).sort();

describe('the JSON Schema', () => {
  it(`${SCHEMA_FILE} is up to date (regenerate: npx tsx scripts/write-schema.ts)`, () => {
    expect(committed).toBe(designBasisJsonSchemaText());
  });

  it('is draft 7, closed to unknown keys, and carries unit patterns', () => {
    const schema = designBasisJsonSchema() as { $schema: string; additionalProperties: boolean; definitions: Record<string, { pattern: string }> };
    expect(schema.$schema).toBe('http://json-schema.org/draft-07/schema#');
    expect(schema.additionalProperties).toBe(false);
    expect(new RegExp(schema.definitions['temperature-text']!.pattern, 'u').test('800 °C')).toBe(true);
  });

  it('accepts the base fixture and rejects a misspelt key and a unit of the wrong dimension', () => {
    expect(validate(parse(BASE)), JSON.stringify(validate.errors)).toBe(true);
    expect(validate(parse(edit(BASE, ['operating-temperature:', 'operating-temprature:'])))).toBe(false);
    expect(validate(parse(edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: "1.2 bar"'])))).toBe(false);
  });

  it('there are demo bases to check (projects/ is not empty)', () => {
    expect(demoIds.length).toBeGreaterThanOrEqual(4);
  });

  it.each(demoIds)('validates the demo basis projects/%s/basis.yaml, which the loader accepts too', (id) => {
    const text = readFileSync(new URL(`${id}/basis.yaml`, PROJECTS), 'utf8');
    expect(validate(parse(text)), JSON.stringify(validate.errors)).toBe(true);
    const result = loadBasisText(text, `projects/${id}/basis.yaml`, id);
    expect(result.ok ? [] : result.errors.map(formatDiagnostic)).toEqual([]);
  });
});

describe('scaffolds', () => {
  it('there is one for every mode of every technology', () => {
    const kinds = scaffoldKinds();
    expect(kinds.length).toBe([...technologies().values()].reduce((n, t) => n + t.modes.length, 0));
    for (const k of kinds) expect(hasScaffold(k.technology, k.mode), `${k.technology}-${k.mode}`).toBe(true);
  });

  it.each(scaffoldKinds().map((k) => [`${k.technology} ${k.mode}`, k] as const))('%s: valid, no warnings, valid against the JSON Schema', (_name, k) => {
    const text = renderScaffold(k.technology, k.mode, 'demo-1', '2026-11-20');
    expect(text.split('\n')[0]).toBe('# yaml-language-server: $schema=../../schema/design-basis.schema.json');
    expect(text).not.toMatch(/\{\{/);
    const result = loadBasisText(text, 'projects/demo-1/basis.yaml', 'demo-1');
    expect(result.ok ? [] : result.errors.map(formatDiagnostic)).toEqual([]);
    expect(result.warnings.map(formatDiagnostic)).toEqual([]);
    if (result.ok) {
      expect(result.basis.cell.technology).toBe(k.technology);
      expect(result.basis.cell.mode).toBe(k.mode);
      expect(result.basis.document.signOff.prepared?.date).toBe('2026-11-20');
    }
    expect(validate(parse(text)), JSON.stringify(validate.errors)).toBe(true);
  });

  it.each(scaffoldKinds().map((k) => [`${k.technology} ${k.mode}`, k] as const))('%s: every key is explained by a comment on its line', (_name, k) => {
    const lines = renderScaffold(k.technology, k.mode, 'demo-1', '2026-11-20').split('\n');
    const keyLines = lines.filter((line) => /^\s*[a-z-]+:/.test(line));
    expect(keyLines.length).toBeGreaterThan(30);
    for (const line of keyLines) expect(line, line).toMatch(/\s#\s\S/);
  });
});
