/** `scatterbook schema`: prints the JSON Schema of part files, for editors to complete and check them. */
import { partJsonSchemaText } from '../spec/json-schema.js';
import { parseArgs, UsageError } from './args.js';
import { EXIT, type Command } from './command.js';

export const schemaCommand: Command = {
  name: 'schema',
  usage: 'scatterbook schema',
  flags: [],
  run(argv, t) {
    const args = parseArgs(argv, []);
    if (args.positionals.length) throw new UsageError('schema takes no arguments');
    t.stdout.write(partJsonSchemaText());
    return EXIT.ok;
  },
};
