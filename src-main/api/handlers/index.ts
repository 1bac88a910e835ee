import type { ChannelHandlers } from '../dispatcher.js';
import { createPlanHandlers } from './planHandlers.js';
import { createInspectionHandlers } from './inspectionHandlers.js';

/** Where the handlers keep and find data; one per app instance. */
export interface HandlerContext {
  dataDirectory: string;
}

/** Every channel's handler, for either adapter. */
export function createHandlers(context: HandlerContext): ChannelHandlers {
  return {
    ...createPlanHandlers(context),
    ...createInspectionHandlers(context),
  };
}
