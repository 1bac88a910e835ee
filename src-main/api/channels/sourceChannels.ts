import { z } from 'zod';
import { idSchema } from '../../store/ids.js';
import { shortText } from '../../store/textFields.js';
import type { SourceSummary } from '../../history/index.js';
import type { RunRow } from '../../inspection/index.js';
import type { Source } from '../../store/sources.js';

const sourceId = idSchema('source');
const sourceName = shortText('A source name', 'A source needs a name.');
const kind = z.enum(['supplier', 'line', 'machine']);
const part = z.object({
  name: shortText('A part name', 'A part needs a name.'),
  characteristics: z.array(z.string().trim().min(1, 'A characteristic needs a name.').max(120)).max(100),
});
const parts = z
  .array(part)
  .max(200)
  .refine((list) => new Set(list.map((entry) => entry.name.toLowerCase())).size === list.length, 'Each part is listed once.');

/** Channels of the Sources place: the register and the per-source summary. */
export const sourceChannels = {
  /** Every source with its run counts; retired ones only when asked for. */
  'source.list': { input: z.object({ includeRetired: z.boolean().optional() }).nullable().optional() },
  'source.create': { input: z.object({ name: sourceName, kind, parts: parts.optional() }) },
  'source.rename': { input: z.object({ id: sourceId, name: sourceName }) },
  /** Replaces the source's parts and their characteristics. */
  'source.setParts': { input: z.object({ id: sourceId, parts }) },
  /** Hides the source from pickers; its plans and runs stay. */
  'source.retire': { input: z.object({ id: sourceId }) },
  /** The source's runs summed up, the decisions over time and the pooled figure with its caveat. */
  'source.summary': { input: z.object({ id: sourceId }) },
  /** Fills an empty data folder with the invented demo scenario (the first-run offer). */
  'source.demo': { input: z.null().optional() },
} as const;

/** A source in the register, with how many runs it has and how they stand. */
export interface SourceListItem extends Source {
  runs: number;
  accepted: number;
  rejected: number;
  lastRunAt: string | null;
}

export interface SourceSummaryView {
  source: Source;
  summary: SourceSummary;
  /** Why the pooled figure is not an estimate to act on. */
  caveat: string;
  /** The source's runs, newest first. */
  runs: RunRow[];
}

export interface SourceChannelOutputs {
  'source.list': SourceListItem[];
  'source.create': Source;
  'source.rename': Source;
  'source.setParts': Source;
  'source.retire': Source;
  'source.summary': SourceSummaryView;
  'source.demo': { sources: number; plans: number; runs: number };
}
