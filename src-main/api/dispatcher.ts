import { channels, isChannelName, type ChannelName, type ChannelOutput, type ChannelParsedInput } from './contract.js';
import { ChannelFailure, type ChannelResult } from './result.js';
import { PlanParameterError } from '../engine/index.js';

/** One handler per channel, taking the validated payload. */
export type ChannelHandlers = {
  [C in ChannelName]: (input: ChannelParsedInput<C>) => Promise<ChannelOutput<C>> | ChannelOutput<C>;
};

export type Dispatch = (channel: string, payload: unknown) => Promise<ChannelResult<unknown>>;

/**
 * Validates a request against the contract, runs its handler, and turns every failure into a
 * `{ ok: false, code, message }` result. Both adapters call this and nothing else.
 */
export function createDispatcher(handlers: ChannelHandlers): Dispatch {
  return async (channel, payload) => {
    if (!isChannelName(channel)) {
      return { ok: false, code: 'unknown-channel', message: `There is no channel named "${channel}".` };
    }
    const parsed = channels[channel].input.safeParse(payload);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const field = issue?.path.join('.') || undefined;
      const where = field ? `${field}: ` : '';
      return { ok: false, code: 'invalid-payload', message: `${where}${issue?.message ?? 'invalid payload'}`, field };
    }
    try {
      const handler = handlers[channel] as (input: unknown) => unknown;
      return { ok: true, value: await handler(parsed.data) };
    } catch (error) {
      return failureOf(error);
    }
  };
}

function failureOf(error: unknown): ChannelResult<never> {
  if (error instanceof PlanParameterError) {
    return { ok: false, code: 'invalid-parameter', message: error.message, field: error.parameter };
  }
  if (error instanceof ChannelFailure) {
    return { ok: false, code: error.code, message: error.message, field: error.field };
  }
  const message = error instanceof Error ? error.message : String(error);
  return { ok: false, code: 'internal', message };
}
