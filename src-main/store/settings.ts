/** The app's settings file: organisation, site, confidence level for reported intervals, theme. */
import { z } from 'zod';
import { readJsonFileIfPresent, writeJsonFile } from './jsonFile.js';
import { layout } from './layout.js';

export const SETTINGS_FORMAT = 'tallyline.settings/1';

export const settingsSchema = z.object({
  format: z.literal(SETTINGS_FORMAT),
  organisationName: z.string(),
  site: z.string(),
  confidenceLevel: z.number().gt(0.5).lt(1),
  theme: z.enum(['system', 'light', 'dark']),
});

export type Settings = z.infer<typeof settingsSchema>;
export type SettingsChange = Partial<Omit<Settings, 'format'>>;

export const DEFAULT_SETTINGS: Settings = {
  format: SETTINGS_FORMAT,
  organisationName: '',
  site: '',
  confidenceLevel: 0.9,
  theme: 'system',
};

export class SettingsRepository {
  constructor(private readonly dataDirectory: string) {}

  /** The saved settings, or the defaults when none were saved yet. */
  async get(): Promise<Settings> {
    return (await readJsonFileIfPresent(layout.settingsFile(this.dataDirectory), settingsSchema)) ?? { ...DEFAULT_SETTINGS };
  }

  async update(change: SettingsChange): Promise<Settings> {
    const next = settingsSchema.parse({ ...(await this.get()), ...change, format: SETTINGS_FORMAT });
    await writeJsonFile(layout.settingsFile(this.dataDirectory), next);
    return next;
  }
}
