import { DataFolderNotEmptyError, seedDemo } from '../../demo/index.js';
import { POOLING_CAVEAT, summariseSource } from '../../history/index.js';
import { createRunCatalogue, type RunCatalogue, type RunRow } from '../../inspection/index.js';
import { SourceRepository, type Source } from '../../store/index.js';
import type { SourceListItem } from '../channels/sourceChannels.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';

type SourceHandlers = Pick<
  ChannelHandlers,
  'source.list' | 'source.create' | 'source.rename' | 'source.setParts' | 'source.retire' | 'source.summary' | 'source.demo'
>;

export interface SourceHandlerContext {
  dataDirectory: string;
  catalogue?: RunCatalogue;
}

export function createSourceHandlers(context: SourceHandlerContext): SourceHandlers {
  const sources = new SourceRepository(context.dataDirectory);
  const catalogue = context.catalogue ?? createRunCatalogue(context.dataDirectory);

  async function existing(id: string): Promise<Source> {
    try {
      return await sources.get(id);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new ChannelFailure('not-found', `There is no source with id ${id}.`, 'id');
      throw error;
    }
  }

  /** The repository's name check, as a failure the form can show beside the name. */
  async function named<Value>(change: () => Promise<Value>): Promise<Value> {
    try {
      return await change();
    } catch (error) {
      if (error instanceof Error && /already exists/.test(error.message)) {
        throw new ChannelFailure('conflict', `${error.message.charAt(0).toUpperCase()}${error.message.slice(1)}.`, 'name');
      }
      throw error;
    }
  }

  async function runsBySource(): Promise<Map<string, RunRow[]>> {
    const grouped = new Map<string, RunRow[]>();
    for (const row of await catalogue.listRuns()) {
      if (row.sourceId === null) continue;
      const list = grouped.get(row.sourceId);
      if (list === undefined) grouped.set(row.sourceId, [row]);
      else list.push(row);
    }
    return grouped;
  }

  return {
    'source.list': async (input) => {
      const [list, grouped] = await Promise.all([sources.list({ includeRetired: input?.includeRetired === true }), runsBySource()]);
      return list.map((source): SourceListItem => {
        const summary = summariseSource(grouped.get(source.id) ?? []);
        return { ...source, runs: summary.runs, accepted: summary.accepted, rejected: summary.rejected, lastRunAt: summary.lastRunAt };
      });
    },

    'source.create': ({ name, kind, parts }) => named(() => sources.create({ name, kind, parts })),

    'source.rename': async ({ id, name }) => {
      await existing(id);
      return named(() => sources.rename(id, name));
    },

    'source.setParts': async ({ id, parts }) => {
      await existing(id);
      return sources.setParts(id, parts);
    },

    'source.retire': async ({ id }) => {
      const source = await existing(id);
      if (source.retired) throw new ChannelFailure('conflict', `${source.name} is already retired.`, 'id');
      return sources.retire(id);
    },

    'source.summary': async ({ id }) => {
      const source = await existing(id);
      const runs = await catalogue.listRuns({ sourceId: id });
      return { source, summary: summariseSource(runs), caveat: POOLING_CAVEAT, runs };
    },

    'source.demo': async () => {
      try {
        const report = await seedDemo(context.dataDirectory);
        return { sources: report.sources.length, plans: report.plans.length, runs: report.runs.length };
      } catch (error) {
        if (error instanceof DataFolderNotEmptyError) throw new ChannelFailure('conflict', error.message);
        throw error;
      }
    },
  };
}
