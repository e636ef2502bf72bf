/**
 * Plot rendering off the main thread: a small pool of worker threads (one per
 * core, at most four) that turn PlotModels into SVG, so the figures of the
 * next part are computed while the plots of this one are drawn. Used when
 * running compiled (dist/); elsewhere (tests through tsx) plots render in
 * this thread. The result is the same SVG either way.
 */
import { writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { PlotModel } from './model.js';
import { renderPlot } from './render.js';

/** The old-generation cap of each plot worker, in MB (SCATTERBOOK_WORKER_HEAP_MB sets another). */
const WORKER_HEAP_MB = Number(process.env.SCATTERBOOK_WORKER_HEAP_MB) >= 64 ? Number(process.env.SCATTERBOOK_WORKER_HEAP_MB) : 256;

interface Job {
  readonly resolve: (svg: string) => void;
  readonly reject: (e: Error) => void;
}

class Pool {
  private readonly workers: Worker[] = [];
  private readonly idle: Worker[] = [];
  private readonly queue: Array<{ model: PlotModel; prefix: string; file?: string; job: Job }> = [];
  private readonly running = new Map<Worker, Job>();

  constructor(size: number, url: URL) {
    for (let i = 0; i < size; i++) {
      // a plot worker's live data are a few megabytes; without a cap V8 lets its heap grow with the garbage of thousands of plots
      const w = new Worker(url, { resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB } });
      w.on('message', (msg: { svg?: string; error?: string; message?: string; fault?: { code: string; errno?: number; path?: string; syscall?: string } }) => {
        const job = this.running.get(w);
        this.running.delete(w);
        if (job) {
          // a file-system fault keeps its code, errno, path and syscall, so that it is worded as the machine's (io/fault.ts)
          if (msg.error !== undefined) job.reject(msg.fault ? Object.assign(new Error(msg.message), msg.fault) : new Error(msg.error));
          else job.resolve(msg.svg as string);
        }
        w.unref();
        this.idle.push(w);
        this.next();
      });
      w.on('error', (e) => {
        const job = this.running.get(w);
        this.running.delete(w);
        job?.reject(e);
      });
      // a busy worker keeps the process alive, an idle one does not (a plain Eleventy run never closes the pool);
      // unref'd after the listeners, which ref it again
      w.unref();
      this.workers.push(w);
      this.idle.push(w);
    }
  }

  render(model: PlotModel, prefix: string, file?: string): Promise<string> {
    return new Promise((resolve, reject) => {
      this.queue.push({ model, prefix, file, job: { resolve, reject } });
      this.next();
    });
  }

  private next(): void {
    while (this.idle.length && this.queue.length) {
      const w = this.idle.pop() as Worker;
      const { model, prefix, file, job } = this.queue.shift() as (typeof this.queue)[number];
      this.running.set(w, job);
      w.ref();
      w.postMessage({ model, prefix, file });
    }
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}

let pool: Pool | null | undefined;

function getPool(): Pool | null {
  if (pool !== undefined) return pool;
  const compiled = import.meta.url.endsWith('.js');
  const size = Math.min(4, Math.max(1, availableParallelism()));
  pool = compiled && size > 1 ? new Pool(size, new URL('./render-worker.js', import.meta.url)) : null;
  return pool;
}

/** The plot's SVG; or, given a file, the SVG written there (by the thread that drew it) and ''. */
export async function renderPlotAnywhere(model: PlotModel, prefix: string, file?: string): Promise<string> {
  const p = getPool();
  if (p) return p.render(model, prefix, file);
  const svg = await renderPlot(model, prefix);
  if (!file) return svg;
  writeFileSync(file, svg);
  return '';
}

export async function closePlotPool(): Promise<void> {
  if (pool) await pool.close();
  pool = undefined;
}
