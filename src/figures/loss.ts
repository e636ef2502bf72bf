/**
 * Level figures of one parameter X at each point (a microwave engineering
 * handbook such as Pozar's; common practice):
 *   insertion-loss, mainline-loss, isolation, rejection, coupling, return-loss:  −20·log10|X| dB
 *   gain: 20·log10|X| dB;  vswr: (1 + |X|)/(1 − |X|);  mismatch-loss: −10·log10(1 − |X|²) dB
 *   excess-loss (dividers, hybrids, couplers, baluns): −20·log10|X| − 10·log10(N) dB, N = ways, or the class's
 *   default (a divider ports − 1, a hybrid, coupler or balun 2)
 */
import { classOf } from '../classes/registry.js';
import { entry } from '../network/network.js';
import { db, lossDb, mismatchLoss, vswr } from '../network/traces.js';
import type { FigureContext, FigureDef, Item } from './types.js';

const trace = (ctx: FigureContext, item: Item) => entry(ctx.network, item.params[0].to, item.params[0].from);

function lossFigure(id: string, title: string, worse: 'higher' | 'lower', what: string): FigureDef {
  return {
    id,
    title,
    unit: 'dB',
    operands: 'each',
    shape: 'trace',
    worse,
    definition: `${what}: −20·log10|X| dB at each point`,
    perPoint: (ctx, item) => lossDb(trace(ctx, item)),
  };
}

export const LOSS_FIGURES: readonly FigureDef[] = [
  lossFigure('insertion-loss', 'Insertion loss', 'higher', 'loss of a transmission X'),
  lossFigure('mainline-loss', 'Mainline loss', 'higher', "loss of a coupler's through path X"),
  lossFigure('isolation', 'Isolation', 'lower', 'loss between ports that should not couple'),
  lossFigure('rejection', 'Rejection', 'lower', 'loss of a transmission outside the passband'),
  lossFigure('coupling', 'Coupling', 'higher', 'loss from the input to the coupled port'),
  lossFigure('return-loss', 'Return loss', 'lower', 'loss of a reflection X'),
  {
    id: 'gain',
    title: 'Gain',
    unit: 'dB',
    operands: 'each',
    shape: 'trace',
    worse: 'lower',
    definition: 'transducer gain: 20·log10|X| dB at each point',
    perPoint: (ctx, item) => db(trace(ctx, item)),
  },
  {
    id: 'vswr',
    title: 'VSWR',
    unit: '',
    operands: 'each',
    shape: 'trace',
    worse: 'higher',
    definition: '(1 + |X|)/(1 − |X|) of a reflection X',
    perPoint: (ctx, item) => vswr(trace(ctx, item)),
  },
  {
    id: 'mismatch-loss',
    title: 'Mismatch loss',
    unit: 'dB',
    operands: 'each',
    shape: 'trace',
    worse: 'higher',
    definition: 'power lost to reflection: −10·log10(1 − |X|²) dB',
    perPoint: (ctx, item) => mismatchLoss(trace(ctx, item)),
  },
  {
    id: 'excess-loss',
    title: 'Excess loss',
    unit: 'dB',
    operands: 'each',
    shape: 'trace',
    worse: 'higher',
    definition: 'insertion loss above the ideal split: −20·log10|X| − 10·log10(N) dB, N = ways (default: a divider ports − 1; a hybrid, coupler or balun 2)',
    perPoint: (ctx, item) => {
      const n = ctx.part.ways ?? classOf(ctx.part.partClass).ways(ctx.network.ports);
      const split = 10 * Math.log10(n);
      return lossDb(trace(ctx, item)).map((v) => v - split);
    },
  },
];
