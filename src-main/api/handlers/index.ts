import type { RunService } from '../../inspection/index.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { createPlanHandlers } from './planHandlers.js';
import { createInspectionHandlers } from './inspectionHandlers.js';
import { createRecordHandlers } from './recordHandlers.js';
import { createSourceHandlers } from './sourceHandlers.js';
import { createSettingsHandlers } from './settingsHandlers.js';

/** Where the handlers keep and find data; one per app instance. */
export interface HandlerContext {
  dataDirectory: string;
  /** The run service behind the inspection channels; one is made when not given. */
  runService?: RunService;
}

/** Every channel's handler, for either adapter. */
export function createHandlers(context: HandlerContext): ChannelHandlers {
  return {
    ...createPlanHandlers(context),
    ...createInspectionHandlers(context),
    ...createRecordHandlers(context),
    ...createSourceHandlers(context),
    ...createSettingsHandlers(context),
  };
}
