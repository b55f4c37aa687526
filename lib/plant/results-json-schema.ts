/**
 * The JSON Schema of the results file, generated from the zod schema (results-schema.ts). The
 * committed copy, schema/results.schema.json, is rewritten by `npx tsx scripts/write-schema.ts`;
 * a test keeps it equal to this.
 */
import { z } from 'zod';
import { resultsSchema } from './results-schema.ts';

export const RESULTS_SCHEMA_FILE = 'schema/results.schema.json';

export function resultsJsonSchemaText(): string {
  return `${JSON.stringify(z.toJSONSchema(resultsSchema, { target: 'draft-7' }), null, 2)}\n`;
}
