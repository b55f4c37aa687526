/** `cellbasis schema`: prints the JSON Schema of a design basis, for editors. */
import type { Command } from '../command.ts';
import { designBasisJsonSchemaText, SCHEMA_FILE } from '../../basis/json-schema.ts';

export const schemaCommand: Command = {
  name: 'schema',
  summary: 'print the JSON Schema of a design basis (for editors)',
  usage: 'schema',
  details:
    `The same schema as ${SCHEMA_FILE}. Point the YAML language server at it with a first line\n` +
    '# yaml-language-server: $schema=../../schema/design-basis.schema.json',
  positionals: [0, 0],
  options: [],
  run(_args, io) {
    io.out(designBasisJsonSchemaText());
    return 0;
  },
};
