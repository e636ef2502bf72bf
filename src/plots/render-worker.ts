/**
 * A plot-rendering worker thread (pool.ts): PlotModel in, SVG out — or, given
 * a file, the SVG written there and '' out, so that the plot's text never
 * passes through the main thread's heap.
 */
import { writeFileSync } from 'node:fs';
import { parentPort } from 'node:worker_threads';
import type { PlotModel } from './model.js';
import { renderPlot } from './render.js';

parentPort?.on('message', (msg: { model: PlotModel; prefix: string; file?: string }) => {
  renderPlot(msg.model, msg.prefix)
    .then((svg) => {
      if (!msg.file) return svg;
      writeFileSync(msg.file, svg);
      return '';
    })
    .then(
      (svg) => parentPort?.postMessage({ svg }),
      // the errno code goes along: a full disk is the machine's fault, worded for the user (io/fault.ts), not a bug
      (e: NodeJS.ErrnoException) =>
        parentPort?.postMessage({
          error: e.stack ?? String(e),
          message: e.message,
          fault: e.code ? { code: e.code, errno: e.errno, path: e.path, syscall: e.syscall } : undefined,
        }),
    );
});
