// Writes schema/design-basis.schema.json from the zod schema of lib/basis/schema.ts.
// Run after changing the schema: npx tsx scripts/write-schema.ts
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { designBasisJsonSchemaText, SCHEMA_FILE } from '../lib/basis/json-schema.ts';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const target = join(root, SCHEMA_FILE);
mkdirSync(dirname(target), { recursive: true });
writeFileSync(target, designBasisJsonSchemaText());
console.log(`wrote ${SCHEMA_FILE}`);
