/** `scatterbook schema [part|comparison]`: prints the JSON Schema of part files (the default) or comparison files, for editors to complete and check them. */
import { comparisonJsonSchemaText, partJsonSchemaText } from '../part-file/json-schema.js';
import { parseArgs, UsageError } from './args.js';
import { EXIT, type Command } from './command.js';

const KINDS: Record<string, () => string> = { part: partJsonSchemaText, comparison: comparisonJsonSchemaText };

export const schemaCommand: Command = {
  name: 'schema',
  usage: 'scatterbook schema [part|comparison]',
  flags: [],
  run(argv, t) {
    const args = parseArgs(argv, []);
    if (args.positionals.length > 1) throw new UsageError('schema takes at most one argument: part or comparison');
    const kind = args.positionals[0] ?? 'part';
    const text = KINDS[kind];
    if (!text) throw new UsageError(`schema: "${kind}" is not a kind of file; expected part or comparison`);
    t.stdout.write(text());
    return EXIT.ok;
  },
};
