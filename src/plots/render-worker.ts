/** A plot-rendering worker thread (pool.ts): PlotModel in, SVG out. */
import { parentPort } from 'node:worker_threads';
import type { PlotModel } from './model.js';
import { renderPlot } from './render.js';

parentPort?.on('message', (msg: { model: PlotModel; prefix: string }) => {
  renderPlot(msg.model, msg.prefix).then(
    (svg) => parentPort?.postMessage({ svg }),
    (e: Error) => parentPort?.postMessage({ error: e.stack ?? String(e) }),
  );
});
