/**
 * `scatterbook merge SHARD_OUTPUT… --out SITE [--content DIR]`: joins the
 * outputs of `build --shard K/N` (every K of one N, built by one build of
 * scatterbook from one content folder) into one site without rendering a
 * part again: each slice's pages, PDFs and files are copied, then the index,
 * the catalog's exports and the manifest are made from the slices' page
 * models, as a whole build makes them — so the same parts give the same site,
 * byte for byte. The output folder follows the build's rules (staged, swapped
 * in whole, only over a folder scatterbook made).
 */
import { copyFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { MANIFEST, siteFiles } from '../archive/manifest.js';
import { sealSite } from '../archive/seal.js';
import { printable } from '../format/escape.js';
import { describeFault } from '../io/fault.js';
import { outputRefusal, SITE_MARKER } from '../io/output-folder.js';
import { discard, removeDeadBuilds, stagingFolder, swapInto } from '../io/swap.js';
import { toolBuildId } from '../pipeline/cache.js';
import { assembleCatalog, readSettings } from '../pipeline/catalog.js';
import { writeSite } from '../site/eleventy-run.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { packageVersion, SHARD_RECORD } from './build-command.js';
import { EXIT, type Command } from './command.js';
import { painter, type Terminal } from './terminal.js';
import type { Catalog } from '../model/catalog.js';

const FLAGS: FlagSpec[] = [
  { name: 'out', value: true, help: 'the joined site (default _site)' },
  { name: 'content', value: true, help: 'the content folder the slices were built from (default: the one their records name)' },
];

interface ShardRecord {
  readonly format: number;
  readonly shard: { readonly k: number; readonly n: number };
  readonly tool: string;
  readonly version: string;
  readonly content: string;
  readonly catalog: Catalog;
}

/** Files of a slice's output to copy: all but what the join makes anew. */
const MADE_BY_MERGE = new Set(['index.html', MANIFEST, 'figures.json', 'figures.csv', SHARD_RECORD, SITE_MARKER]);

/** A slice's files to copy (the manifest is not among siteFiles'). */
const files = (root: string) => siteFiles(root).filter((f) => !MADE_BY_MERGE.has(f));

export const mergeCommand: Command = {
  name: 'merge',
  usage: 'scatterbook merge SHARD_OUTPUT… --out SITE [--content DIR]',
  flags: FLAGS,
  async run(argv, t: Terminal) {
    const args = parseArgs(argv, FLAGS);
    if (!args.positionals.length) throw new UsageError('merge takes the output folders of build --shard K/N, one for each K');
    const p = painter(t.stderr, t.env);
    const rel = (x: string) => relative(t.cwd, x) || '.';
    const fail = (message: string) => {
      t.stderr.write(`${p.red('error:')} ${printable(message)}\n`);
      return EXIT.badInput;
    };
    const records: Array<{ dir: string; r: ShardRecord }> = [];
    for (const d of args.positionals) {
      const dir = resolve(t.cwd, d);
      const file = join(dir, SHARD_RECORD);
      if (!existsSync(file)) return fail(`${d}: not the output of build --shard K/N (no ${SHARD_RECORD})`);
      let r: ShardRecord;
      try {
        r = JSON.parse(readFileSync(file, 'utf8')) as ShardRecord;
      } catch (e) {
        return fail(`${d}/${SHARD_RECORD}: cannot be read: ${(e as Error).message}`);
      }
      records.push({ dir, r });
    }
    const n = records[0].r.shard.n;
    for (const { dir, r } of records) {
      if (r.shard.n !== n)
        return fail(`${rel(dir)} is slice ${r.shard.k}/${r.shard.n}, but ${rel(records[0].dir)} is one of ${n}: merge the slices of one split`);
      if (r.tool !== toolBuildId())
        return fail(`${rel(dir)} was built by another build of scatterbook (${r.version}); build every slice and merge with the same one`);
    }
    const ks = records.map((x) => x.r.shard.k).sort((a, b) => a - b);
    const missing = Array.from({ length: n }, (_, i) => i + 1).filter((k) => !ks.includes(k));
    const twice = ks.filter((k, i) => ks[i - 1] === k);
    if (missing.length || twice.length)
      return fail(
        `the slices of ${n} are ${ks.join(', ')}: ${missing.length ? `slice${missing.length > 1 ? 's' : ''} ${missing.join(', ')} missing` : ''}${missing.length && twice.length ? '; ' : ''}${twice.length ? `slice${twice.length > 1 ? 's' : ''} ${[...new Set(twice)].join(', ')} given twice` : ''}`,
      );
    const content = resolve(t.cwd, (args.flags.get('content') as string | undefined) ?? records[0].r.content);
    if (!existsSync(content))
      return fail(`the content folder ${rel(content)} is not here; give it with --content DIR (its site.yaml, assets and templates make the index)`);
    const out = resolve(t.cwd, (args.flags.get('out') as string | undefined) ?? '_site');
    const shown = rel(out);
    const refusal = outputRefusal(out, { content, cwd: t.cwd, home: t.env.HOME }, shown);
    if (refusal) return fail(refusal);
    const { settings, errors } = readSettings(content);
    if (errors.length) {
      for (const e of errors) t.stderr.write(`${e}\n`);
      return EXIT.badInput;
    }
    const bySlug = (a: { slug: string }, b: { slug: string }) => (a.slug < b.slug ? -1 : a.slug > b.slug ? 1 : 0);
    const parts = records.flatMap((x) => x.r.catalog.parts).sort(bySlug);
    const failures = records.flatMap((x) => x.r.catalog.failures).sort(bySlug);
    const comparisons = records.flatMap((x) => x.r.catalog.comparisons);
    const whole = assembleCatalog(settings, parts, failures, packageVersion(), comparisons);
    // the index only: every other page was rendered by its slice
    const joined: Catalog = { ...whole, pages: { parts: [], reports: [], comparisons: [] } };
    removeDeadBuilds(out);
    const staging = stagingFolder(out);
    try {
      const from = new Map<string, { src: string; dir: string }>();
      for (const { dir } of records) {
        for (const f of files(dir)) {
          const src = join(dir, f),
            dst = join(staging.dir, f);
          const seen = from.get(f);
          if (seen !== undefined) {
            if (!readFileSync(seen.src).equals(readFileSync(src)))
              throw new MergeConflict(`${f} differs between ${rel(seen.dir)} and ${rel(dir)}: were the slices built from one content folder?`);
            continue;
          }
          mkdirSync(dirname(dst), { recursive: true });
          copyFileSync(src, dst);
          from.set(f, { src, dir });
        }
      }
      await writeSite(content, joined, staging.dir);
      // each part's files came with its slice (its median's text stayed on the machine that built it)
      sealSite(whole, staging.dir, packageVersion(), { medians: false });
      swapInto(staging);
    } catch (e) {
      discard(staging);
      if (e instanceof MergeConflict) return fail(`${e.message}; nothing was written (${shown} is unchanged)`);
      const fault = describeFault(e, rel, `writing the joined site ${shown}`);
      if (fault === null) throw e;
      return fail(`${fault}; nothing was written (${shown} is unchanged)`);
    }
    t.stdout.write(
      `joined ${n} slice${n === 1 ? '' : 's'}: ${parts.length} part${parts.length === 1 ? '' : 's'}${comparisons.length ? ` and ${comparisons.length} comparison${comparisons.length === 1 ? '' : 's'}` : ''} into ${shown}/\n`,
    );
    return failures.length ? EXIT.badInput : EXIT.ok;
  },
};

class MergeConflict extends Error {}
