/**
 * Runs plan designs off the request path, in a worker thread (node:worker_threads), so that journal
 * appends and every other channel answer while a design computes. Requests queue for one worker
 * (the machines this runs on have two cores; the other serves requests). A newer request of the
 * same stream (one form's edits) supersedes the older ones: a queued one is dropped, a running one
 * is stopped by ending its worker, and a fresh worker takes the rest of the queue.
 *
 * Where the compiled worker script is missing (the engine loaded from TypeScript sources, as unit
 * tests do), designs run on the calling thread instead; the built app always has the script. A
 * worker that fails before its first answer (a packaging that cannot start one) also falls back to
 * the calling thread, so designs keep working, only on the request path.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { designPlan, PlanParameterError, type DesignOptions, type PlanDesign, type PlanSpec } from '../../engine/index.js';
import type { DesignReply, DesignRequest } from './designMessages.js';

/** What a superseded request resolves to. */
export const SUPERSEDED = Symbol('superseded');

export interface DesignRunner {
  /** Whether designs run in a worker thread (false: on the calling thread). */
  readonly inWorker: boolean;
  /**
   * Designs a plan; resolves to SUPERSEDED when a later request of the same stream came first.
   * @throws PlanParameterError for a spec the engine refuses.
   */
  design(spec: PlanSpec, options: DesignOptions, stream?: string): Promise<PlanDesign | typeof SUPERSEDED>;
  /** Ends the worker; later designs start a new one. */
  close(): Promise<void>;
}

interface Job {
  readonly request: DesignRequest;
  readonly stream: string | undefined;
  resolve(value: PlanDesign | typeof SUPERSEDED): void;
  reject(error: Error): void;
}

const workerScript = new URL('./designWorker.js', import.meta.url);

/** The error a reply carries, rebuilt on this side. */
function replyError(reply: DesignReply): Error | null {
  if ('planParameter' in reply) {
    const { parameter, value, allowed, message } = reply.planParameter;
    return new PlanParameterError(parameter, value, allowed, message);
  }
  if ('failure' in reply) {
    const error = new Error(reply.failure.message);
    error.name = reply.failure.name;
    return error;
  }
  return null;
}

export function createDesignRunner(options: { inWorker?: boolean; workerScript?: URL } = {}): DesignRunner {
  const script = options.workerScript ?? workerScript;
  const inWorker = options.inWorker ?? (script.protocol === 'file:' && existsSync(fileURLToPath(script)));
  if (!inWorker) {
    return {
      inWorker,
      design: async (spec, designOptions) => designPlan(spec, designOptions),
      close: async () => undefined,
    };
  }

  const queue: Job[] = [];
  let running: Job | null = null;
  let worker: Worker | null = null;
  let nextId = 1;
  /** Set once any worker has answered; a worker failing before that means workers cannot start here. */
  let workerAnswered = false;
  let onCallingThread = false;

  function designHere(job: Job): void {
    try {
      job.resolve(designPlan(job.request.spec, job.request.options));
    } catch (error) {
      job.reject(error as Error);
    }
  }

  function startWorker(): Worker {
    const started = new Worker(script);
    // The worker never keeps the app alive on its own.
    started.unref();
    started.on('message', (reply: DesignReply) => {
      workerAnswered = true;
      const job = running;
      if (job === null || job.request.id !== reply.id) return;
      running = null;
      const error = replyError(reply);
      if (error !== null) job.reject(error);
      else job.resolve((reply as { design: PlanDesign }).design);
      pump();
    });
    started.on('error', (error) => {
      const job = running;
      running = null;
      if (worker === started) worker = null;
      if (!workerAnswered) onCallingThread = true;
      if (job !== null) {
        if (onCallingThread) designHere(job);
        else job.reject(error);
      }
      pump();
    });
    started.on('exit', () => {
      if (worker === started) worker = null;
    });
    return started;
  }

  function pump(): void {
    if (running !== null) return;
    const job = queue.shift();
    if (job === undefined) return;
    if (onCallingThread) {
      designHere(job);
      pump();
      return;
    }
    running = job;
    worker ??= startWorker();
    worker.postMessage(job.request);
  }

  /** Drops the stream's queued jobs and stops its running one: a newer request of it arrived. */
  function supersede(stream: string): void {
    for (let index = queue.length - 1; index >= 0; index -= 1) {
      if (queue[index].stream === stream) queue.splice(index, 1)[0].resolve(SUPERSEDED);
    }
    if (running !== null && running.stream === stream && worker !== null) {
      const stopped = running;
      running = null;
      const ending = worker;
      worker = null;
      void ending.terminate();
      stopped.resolve(SUPERSEDED);
    }
  }

  return {
    get inWorker() {
      return !onCallingThread;
    },
    design(spec, designOptions, stream) {
      if (stream !== undefined) supersede(stream);
      return new Promise((resolve, reject) => {
        queue.push({ request: { id: nextId++, spec, options: designOptions }, stream, resolve, reject });
        pump();
      });
    },
    async close() {
      for (const job of queue.splice(0)) job.resolve(SUPERSEDED);
      running?.resolve(SUPERSEDED);
      running = null;
      const ending = worker;
      worker = null;
      await ending?.terminate();
    },
  };
}
