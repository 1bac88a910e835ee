import { createRunCatalogue, type RunCatalogue, type RunService } from '../../inspection/index.js';
import type { ChannelHandlers } from '../dispatcher.js';
import type { DesignRunner } from '../design/designRunner.js';
import { createPlanHandlers } from './planHandlers.js';
import { createInspectionHandlers } from './inspectionHandlers.js';
import { createRecordHandlers } from './recordHandlers.js';
import { createSourceHandlers } from './sourceHandlers.js';
import { createSettingsHandlers } from './settingsHandlers.js';

/** Where the handlers keep and find data; one per app instance. */
export interface HandlerContext {
  dataDirectory: string;
  /** The one reader of runs; every place lists and reads runs through it (made here when not given). */
  catalogue?: RunCatalogue;
  /** The run service behind the inspection channels; one is made when not given. */
  runService?: RunService;
  /** Where plan designs run (a worker thread in the built app); one is made when not given. */
  designRunner?: DesignRunner;
}

/** Every channel's handler, for either adapter. */
export function createHandlers(given: HandlerContext): ChannelHandlers {
  const context = { ...given, catalogue: given.catalogue ?? createRunCatalogue(given.dataDirectory) };
  return {
    ...createPlanHandlers(context),
    ...createInspectionHandlers(context),
    ...createRecordHandlers(context),
    ...createSourceHandlers(context),
    ...createSettingsHandlers(context),
  };
}
