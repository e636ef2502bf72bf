/** The SHA-256 of a file's bytes, hex: what provenance records, manifests and release records keep. */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';

export const sha256File = (path: string): string => createHash('sha256').update(readFileSync(path)).digest('hex');
