/**
 * The JSON Schema of a design basis, generated from the zod schema (schema.ts) for editors:
 * the YAML language server validates and completes a basis whose first line is
 * `# yaml-language-server: $schema=../../schema/design-basis.schema.json`. The committed copy,
 * schema/design-basis.schema.json, is rewritten by `npx tsx scripts/write-schema.ts`; a test
 * keeps it equal to this.
 */
import { z } from 'zod';
import { basisSchema } from './schema.ts';

/** Where the committed copy lives, relative to the repository root. */
export const SCHEMA_FILE = 'schema/design-basis.schema.json';

export function designBasisJsonSchema(): Record<string, unknown> {
  // Draft 7: what the YAML language server and most editors support.
  return z.toJSONSchema(basisSchema, { target: 'draft-7', io: 'input' }) as Record<string, unknown>;
}

/** The file text: two-space JSON with a trailing newline. */
export function designBasisJsonSchemaText(): string {
  return `${JSON.stringify(designBasisJsonSchema(), null, 2)}\n`;
}
