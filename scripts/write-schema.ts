// Writes the JSON Schemas generated from the zod schemas: schema/design-basis.schema.json
// (lib/basis/schema.ts) and schema/results.schema.json (lib/plant/results-schema.ts).
// Run after changing either schema: npx tsx scripts/write-schema.ts
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { designBasisJsonSchemaText, SCHEMA_FILE } from '../lib/basis/json-schema.ts';
import { resultsJsonSchemaText, RESULTS_SCHEMA_FILE } from '../lib/plant/results-json-schema.ts';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
for (const [file, text] of [
  [SCHEMA_FILE, designBasisJsonSchemaText()],
  [RESULTS_SCHEMA_FILE, resultsJsonSchemaText()],
] as const) {
  const target = join(root, file);
  mkdirSync(dirname(target), { recursive: true });
  writeFileSync(target, text);
  console.log(`wrote ${file}`);
}
