/**
 * Custom figures: an expression over whole traces, such as
 * `db(S31) - db(S41)`, evaluated once per unit with mathjs on arrays.
 *
 * Trace functions (each takes one S-parameter; ports above 9 as S10_12):
 *   db, loss_db, magnitude, phase_deg, unwrapped_phase_deg, group_delay, vswr, real_part, imag_part
 * Around them, mathjs arithmetic and functions apply point by point
 * (* / ^ act element-wise, so db(S21) * 2 and magnitude(S21)^2 mean what they say).
 *
 * mathjs is loaded only when a part has custom figures: the shell passes a
 * compiler in (see loadExpressionCompiler), which keeps the core free of it.
 */
import type { MathJsInstance, MathNode } from 'mathjs';
import { entry } from '../network/network.js';
import { db, groupDelay, lossDb, magnitude, phaseDeg, phaseUnwrappedDeg, vswr } from '../network/traces.js';
import type { SParameter } from '../part-file/parameter.js';
import type { FigureContext } from './types.js';

type TraceFn = (ctx: FigureContext, p: SParameter) => Float64Array;

export const TRACE_FUNCTIONS: Readonly<Record<string, { fn: TraceFn; help: string }>> = {
  db: { fn: (c, p) => db(entry(c.network, p.to, p.from)), help: '20·log10|X| dB' },
  loss_db: { fn: (c, p) => lossDb(entry(c.network, p.to, p.from)), help: '−20·log10|X| dB' },
  magnitude: { fn: (c, p) => magnitude(entry(c.network, p.to, p.from)), help: '|X|' },
  phase_deg: { fn: (c, p) => phaseDeg(entry(c.network, p.to, p.from)), help: '∠X in degrees, (−180, 180]' },
  unwrapped_phase_deg: { fn: (c, p) => phaseUnwrappedDeg(entry(c.network, p.to, p.from)), help: 'unwrapped ∠X in degrees' },
  group_delay: { fn: (c, p) => groupDelay(c.network.freqHz, entry(c.network, p.to, p.from), c.aperture), help: 'group delay of X in seconds' },
  vswr: { fn: (c, p) => vswr(entry(c.network, p.to, p.from)), help: '(1 + |X|)/(1 − |X|)' },
  real_part: { fn: (c, p) => entry(c.network, p.to, p.from).re.slice(), help: 'Re X' },
  imag_part: { fn: (c, p) => entry(c.network, p.to, p.from).im.slice(), help: 'Im X' },
};

/** A compiled custom figure: the parameters it reads, and its evaluation. */
export interface CompiledExpression {
  readonly params: readonly SParameter[];
  evaluate(ctx: FigureContext): Float64Array;
}

export type CompileResult = { ok: true; value: CompiledExpression } | { ok: false; message: string };
export type ExpressionCompiler = (source: string) => CompileResult;

const ELEMENTWISE: Record<string, string> = { multiply: 'dotMultiply', divide: 'dotDivide', pow: 'dotPow' };
const CONSTANTS = new Set(['pi', 'e', 'Infinity']);
/** mathjs functions that are not arithmetic on numbers and have no place in a figure. */
const NOT_ARITHMETIC = new Set([
  'import',
  'createUnit',
  'evaluate',
  'parse',
  'compile',
  'simplify',
  'derivative',
  'config',
  'chain',
  'help',
  'reviver',
  'replacer',
  'resolve',
]);

function parameterSymbol(name: string): SParameter | null {
  const m = /^S(\d)(\d)$/.exec(name) ?? /^S(\d+)_(\d+)$/.exec(name);
  return m && Number(m[1]) >= 1 && Number(m[2]) >= 1 ? { to: Number(m[1]), from: Number(m[2]) } : null;
}

export function makeCompiler(math: MathJsInstance): ExpressionCompiler {
  return (source) => {
    let tree: MathNode;
    try {
      tree = math.parse(source);
    } catch (e) {
      return { ok: false, message: `the expression "${source}" does not parse: ${(e as Error).message}` };
    }
    const uses: SParameter[] = [];
    const slots: Array<{ fn: TraceFn; p: SParameter }> = [];
    let problem: string | null = null;
    // Bottom-up rebuild: trace calls become symbols bound to whole traces, and * / ^ become their
    // element-wise forms at every depth (mathjs's own transform() stops at a replaced node).
    const rebuild = (node: MathNode): MathNode => {
      if (problem) return node;
      if (node.type === 'FunctionNode') {
        const fnNode = node as unknown as { fn: { name: string }; args: MathNode[] };
        const name = fnNode.fn.name;
        const tf = TRACE_FUNCTIONS[name];
        if (tf) {
          const arg = fnNode.args[0];
          const p = fnNode.args.length === 1 && arg.type === 'SymbolNode' ? parameterSymbol((arg as unknown as { name: string }).name) : null;
          if (!p) {
            problem = `${name}() takes one S-parameter such as S21 (ports above 9: S10_12), got ${fnNode.args.map((a) => a.toString()).join(', ') || 'nothing'}`;
            return node;
          }
          uses.push(p);
          slots.push({ fn: tf.fn, p });
          return new math.SymbolNode(`__trace${slots.length - 1}`);
        }
        if (NOT_ARITHMETIC.has(name) || typeof (math as unknown as Record<string, unknown>)[name] !== 'function') {
          problem = `unknown function ${name}(); trace functions are ${Object.keys(TRACE_FUNCTIONS).join(', ')}, and around them mathjs functions such as abs, sqrt, log10, max, min`;
          return node;
        }
      }
      const mapped = node.map((child: MathNode) => rebuild(child));
      if (mapped.type === 'OperatorNode') {
        const op = mapped as unknown as { fn: string; args: MathNode[] };
        const el = ELEMENTWISE[op.fn];
        if (el) return new math.FunctionNode(new math.SymbolNode(el), op.args);
      }
      return mapped;
    };
    const transformed = rebuild(tree);
    if (problem) return { ok: false, message: problem };
    const symbols: string[] = [];
    transformed.traverse((node: MathNode, _path: string, parent: MathNode | null) => {
      if (node.type !== 'SymbolNode') return;
      const name = (node as unknown as { name: string }).name;
      const isCallee = parent?.type === 'FunctionNode' && (parent as unknown as { fn: MathNode }).fn === node;
      if (!isCallee && !name.startsWith('__trace') && !CONSTANTS.has(name)) symbols.push(name);
    });
    if (symbols.length) {
      const s = symbols[0];
      const hint = parameterSymbol(s)
        ? `${s} is complex: wrap it in a trace function such as db(${s}) or magnitude(${s})`
        : `expected an S-parameter inside a trace function (${Object.keys(TRACE_FUNCTIONS).join(', ')})`;
      return { ok: false, message: `unknown name "${s}" in "${source}"; ${hint}` };
    }
    if (slots.length === 0) return { ok: false, message: `"${source}" reads no trace; use a trace function such as db(S21)` };
    const code = transformed.compile();
    return {
      ok: true,
      value: {
        params: uses,
        evaluate(ctx) {
          const scope: Record<string, number[]> = {};
          slots.forEach((s, i) => {
            scope[`__trace${i}`] = Array.from(s.fn(ctx, s.p));
          });
          const n = ctx.network.freqHz.length;
          const r = code.evaluate(scope) as unknown;
          const arr = typeof r === 'number' ? new Array(n).fill(r) : math.isMatrix(r) ? (r.toArray() as unknown[]) : (r as unknown[]);
          if (!Array.isArray(arr) || arr.length !== n || arr.some((v) => typeof v !== 'number')) {
            throw new Error(`the expression "${source}" must give one real number per frequency point`);
          }
          return Float64Array.from(arr as number[], (v) => (Number.isFinite(v) ? v : NaN));
        },
      },
    };
  };
}

/** Loads mathjs (≈ 0.5 s, so only when a part needs it) and returns a compiler. */
export async function loadExpressionCompiler(): Promise<ExpressionCompiler> {
  const mathjs = await import('mathjs');
  return makeCompiler(mathjs.create(mathjs.all));
}
