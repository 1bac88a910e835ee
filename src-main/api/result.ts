/**
 * What every channel returns, on both adapters. Thrown errors lose their fields across
 * Electron IPC, so failures travel as data.
 */
export type ChannelResult<T> =
  | { ok: true; value: T }
  | { ok: false; code: FailureCode; message: string; field?: string };

/** Why a request failed, for the renderer to choose how to show it. */
export type FailureCode =
  | 'unknown-channel' // the channel name is not in the contract
  | 'invalid-payload' // the payload does not match the channel's schema
  | 'invalid-parameter' // well-formed, but a value is outside what the method allows
  | 'not-found' // the run, plan or source does not exist
  | 'conflict' // the request contradicts stored state (e.g. a run already decided)
  | 'internal'; // anything else; the message says what

/** An error a handler throws on purpose; the dispatcher turns it into a failure result. */
export class ChannelFailure extends Error {
  constructor(
    readonly code: FailureCode,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'ChannelFailure';
  }
}
