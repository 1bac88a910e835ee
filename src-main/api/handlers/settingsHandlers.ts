import { ArchiveRefusedError, RestoreBlockedError, archiveFileName, exportArchive, restoreArchive } from '../../backup/index.js';
import { SettingsRepository } from '../../store/index.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';

type SettingsHandlers = Pick<ChannelHandlers, 'settings.get' | 'settings.update' | 'settings.dataFolder' | 'settings.backup' | 'settings.restore'>;

export interface SettingsHandlerContext {
  dataDirectory: string;
}

export function createSettingsHandlers(context: SettingsHandlerContext): SettingsHandlers {
  const settings = new SettingsRepository(context.dataDirectory);
  return {
    'settings.get': () => settings.get(),

    'settings.update': (change) => settings.update(change),

    // restoreArchive keeps the replaced folder under this name, stamped with the UTC time of the restore.
    'settings.dataFolder': () => ({ path: context.dataDirectory, keptAs: `${context.dataDirectory}.before-restore-<date and time>` }),

    'settings.backup': async () => {
      const now = new Date();
      const archive = await exportArchive(context.dataDirectory, now);
      return { fileName: archiveFileName(now), base64: archive.bytes.toString('base64'), files: archive.manifest.files.length, bytes: archive.bytes.length };
    },

    'settings.restore': async ({ base64 }) => {
      try {
        return await restoreArchive(Buffer.from(base64, 'base64'), context.dataDirectory);
      } catch (error) {
        if (error instanceof ArchiveRefusedError) throw new ChannelFailure('invalid-payload', error.message, 'archive');
        if (error instanceof RestoreBlockedError) throw new ChannelFailure('conflict', error.message, 'archive');
        throw error;
      }
    },
  };
}
