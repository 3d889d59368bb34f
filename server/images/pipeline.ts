import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { PHOTO_LIMITS } from '../../shared/domain/photos';

export type PipelineRefusal = 'not_image' | 'too_many_pixels' | 'undecodable' | 'internal' | 'timeout';

export type PipelineResult =
  | { ok: true; width: number; height: number; original: Buffer; display: Buffer; thumb: Buffer }
  | { ok: false; reason: PipelineRefusal; width?: number; height?: number; detail?: string };

export interface ImagePipeline {
  /** Decodes, turns upright and re-encodes one image (JPEG out, no metadata) in the worker thread. */
  process(input: Buffer): Promise<PipelineResult>;
  /** Stops the worker; pending jobs fail. */
  close(): Promise<void>;
}

interface Options {
  /** A job that takes longer is abandoned and the worker restarted. */
  timeoutMs?: number;
  /** The worker is stopped after this long with nothing to do, which gives its memory back. */
  idleMs?: number;
}

const WORKER_FILE = path.join(__dirname, 'image-worker.mjs');

const LIMITS = {
  maxPixels: PHOTO_LIMITS.maxPixels,
  maxSide: PHOTO_LIMITS.maxSide,
  thumbSide: PHOTO_LIMITS.thumbSide,
  displaySide: PHOTO_LIMITS.displaySide,
  originalQuality: 90,
  derivedQuality: 82,
};

interface Job {
  id: number;
  input: Buffer;
  resolve: (r: PipelineResult) => void;
}

/**
 * One worker thread, one image at a time: jimp needs about 45 bytes a pixel while it works, so
 * two 12-megapixel photos side by side on a 2-core machine would only slow each other down.
 * Jobs queue in order; a crash or timeout fails that job and the next one gets a fresh worker.
 */
export function createImagePipeline(opts: Options = {}): ImagePipeline {
  const timeoutMs = opts.timeoutMs ?? 120_000;
  const idleMs = opts.idleMs ?? 15_000;
  const queue: Job[] = [];
  let worker: Worker | null = null;
  let current: (Job & { timer: NodeJS.Timeout }) | null = null;
  let idleTimer: NodeJS.Timeout | null = null;
  let nextId = 1;
  let closed = false;

  const finish = (r: PipelineResult) => {
    if (!current) return;
    clearTimeout(current.timer);
    const job = current;
    current = null;
    job.resolve(r);
    pump();
  };

  const spawn = () => {
    const w = new Worker(WORKER_FILE);
    w.on('message', (m: { id: number; ok: boolean } & Record<string, unknown>) => {
      if (!current || m.id !== current.id) return;
      if (m.ok) {
        finish({
          ok: true,
          width: m.width as number,
          height: m.height as number,
          original: Buffer.from(m.original as Uint8Array),
          display: Buffer.from(m.display as Uint8Array),
          thumb: Buffer.from(m.thumb as Uint8Array),
        });
      } else {
        finish({ ok: false, reason: m.reason as PipelineRefusal, width: m.width as number, height: m.height as number, detail: m.detail as string });
      }
    });
    const gone = (detail: string) => {
      // Only the worker running the current job can fail it; one stopped on purpose is already replaced.
      if (worker !== w) return;
      worker = null;
      finish({ ok: false, reason: 'internal', detail });
    };
    w.on('error', (err: Error) => gone(err.message));
    w.on('exit', (code) => gone(`image worker exited (${code})`));
    return w;
  };

  const pump = () => {
    if (current || closed) return;
    const job = queue.shift();
    if (!job) {
      worker?.unref();
      if (worker && !idleTimer) {
        idleTimer = setTimeout(() => {
          idleTimer = null;
          const w = worker;
          worker = null;
          if (w && !current) void w.terminate();
        }, idleMs);
        idleTimer.unref();
      }
      return;
    }
    if (idleTimer) {
      clearTimeout(idleTimer);
      idleTimer = null;
    }
    worker ??= spawn();
    // A job in hand keeps the process alive until it is done; an idle worker does not.
    worker.ref();
    const timer = setTimeout(() => {
      const w = worker;
      worker = null;
      finish({ ok: false, reason: 'timeout' });
      if (w) void w.terminate();
    }, timeoutMs);
    timer.unref();
    current = { ...job, timer };
    // Copy into a buffer of its own so it can be handed over without copying again.
    const ab = new Uint8Array(job.input).buffer;
    worker.postMessage({ id: job.id, input: ab, limits: LIMITS }, [ab]);
  };

  return {
    process(input) {
      if (closed) return Promise.resolve({ ok: false, reason: 'internal', detail: 'pipeline closed' });
      return new Promise((resolve) => {
        queue.push({ id: nextId++, input, resolve });
        pump();
      });
    },
    async close() {
      closed = true;
      for (const j of queue.splice(0)) j.resolve({ ok: false, reason: 'internal', detail: 'pipeline closed' });
      if (idleTimer) clearTimeout(idleTimer);
      const w = worker;
      worker = null;
      finish({ ok: false, reason: 'internal', detail: 'pipeline closed' });
      if (w) await w.terminate();
    },
  };
}
