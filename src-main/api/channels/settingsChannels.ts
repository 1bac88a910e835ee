import { z } from 'zod';
import type { RestoreReport } from '../../backup/index.js';
import type { Settings } from '../../store/settings.js';

/** Largest archive the restore channel takes, as base64 characters; the command line has no limit. */
export const maximumArchiveText = 900_000;

/** Channels of the Settings section: what the decision record prints, and backup and restore. */
export const settingsChannels = {
  'settings.get': { input: z.null().optional() },
  'settings.update': {
    input: z.object({
      organisationName: z.string().trim().max(160).optional(),
      site: z.string().trim().max(160).optional(),
      confidenceLevel: z
        .number()
        .gt(0.5, 'The confidence level is above 50 %.')
        .lt(1, 'The confidence level is below 100 %.')
        .optional(),
      theme: z.enum(['system', 'light', 'dark'], 'The theme is system, light or dark.').optional(),
    }),
  },
  /** Where the data lives and where a restore keeps the data it replaces, for the restore's confirmation. */
  'settings.dataFolder': { input: z.null().optional() },
  /** The whole data folder as one `tallyline.archive/1` file, base64, to download. */
  'settings.backup': { input: z.null().optional() },
  /** Restores an archive (base64) after checking every file and journal; a damaged one is refused. */
  'settings.restore': {
    input: z.object({
      base64: z
        .string()
        .min(1, 'Choose an archive file.')
        .max(maximumArchiveText, 'This archive is too large to restore here: use tallyline restore --from FILE.')
        .regex(/^[A-Za-z0-9+/]*={0,2}$/, 'The archive did not arrive as base64.'),
    }),
  },
} as const;

export interface SettingsChannelOutputs {
  'settings.get': Settings;
  'settings.update': Settings;
  'settings.dataFolder': { path: string; keptAs: string };
  'settings.backup': { fileName: string; base64: string; files: number; bytes: number };
  'settings.restore': RestoreReport;
}
