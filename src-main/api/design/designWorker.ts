/**
 * The worker thread that designs plans for the design runner (designRunner.ts): one request at a
 * time, answered with the design or with the error the engine threw, as plain data.
 */
import { parentPort } from 'node:worker_threads';
import { designPlan, PlanParameterError, type DesignOptions, type PlanSpec } from '../../engine/index.js';
import type { DesignReply, DesignRequest } from './designMessages.js';

if (parentPort === null) throw new Error('designWorker.js runs only as a worker thread');
const port = parentPort;

port.on('message', (request: DesignRequest) => {
  let reply: DesignReply;
  try {
    reply = { id: request.id, design: designPlan(request.spec as PlanSpec, request.options as DesignOptions) };
  } catch (error) {
    reply =
      error instanceof PlanParameterError
        ? { id: request.id, planParameter: { parameter: error.parameter, value: error.value, allowed: error.allowed, message: error.message } }
        : { id: request.id, failure: { name: (error as Error).name ?? 'Error', message: (error as Error).message ?? String(error) } };
  }
  port.postMessage(reply);
});
