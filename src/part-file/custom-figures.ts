/** The part file's custom figures: each expression compiled (mathjs, loaded only for parts that have them) into a figure of its own. */
import { FIGURES } from '../figures/registry.js';
import type { CompiledExpression, ExpressionCompiler } from '../figures/expression.js';
import type { FigureDef, FigureUnit } from '../figures/types.js';
import { isObj, type Context, type Obj } from './context.js';

export function normalizeCustomFigures(
  spec: Obj,
  compile: ExpressionCompiler | undefined,
  { err }: Context,
): { custom: Map<string, FigureDef>; brokenCustom: Set<string>; needsCompiler: boolean } {
  let needsCompiler = false;
  const custom = new Map<string, FigureDef>();
  const brokenCustom = new Set<string>();
  if (isObj(spec['custom-figures'])) {
    for (const [name, c] of Object.entries(spec['custom-figures'])) {
      if (!isObj(c) || typeof c.expression !== 'string' || typeof c.unit !== 'string' || typeof c.worse !== 'string') continue;
      if (FIGURES.has(name)) {
        err('duplicate', `custom-figures#${name}`, `custom figure "${name}" has the name of a built-in figure; choose another name`);
        continue;
      }
      if (!compile) {
        needsCompiler = true; // the caller loads the expression compiler and asks again
        continue;
      }
      const compiled = compile(c.expression);
      if (!compiled.ok) {
        err('bad-expression', `custom-figures.${name}.expression`, compiled.message);
        brokenCustom.add(name);
        continue;
      }
      custom.set(name, customFigure(name, c, compiled.value));
    }
  }

  return { custom, brokenCustom, needsCompiler };
}

export interface CustomFigureDef extends FigureDef {
  readonly expression: string;
  readonly compiled: CompiledExpression;
}

function customFigure(name: string, c: Obj, compiled: CompiledExpression): CustomFigureDef {
  return {
    id: name,
    title: typeof c.title === 'string' ? c.title : name,
    unit: c.unit as FigureUnit,
    operands: 'expression',
    shape: 'trace',
    worse: c.worse === 'lower' ? 'lower' : 'higher',
    definition: `custom: ${c.expression as string}`,
    expression: c.expression as string,
    compiled,
    perPoint: (ctx) => compiled.evaluate(ctx),
  };
}
