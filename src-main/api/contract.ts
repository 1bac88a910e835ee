/**
 * The one list of request/response channels between the renderer and the main side.
 * Both adapters (Electron IPC, browser host) serve exactly this list; the renderer's client
 * is typed by it. Adding a feature: an engine function, a channel here with its schema,
 * its handler, a screen.
 */
import type { z } from 'zod';
import { planChannels, type PlanChannelOutputs } from './channels/planChannels.js';
import { inspectionChannels, type InspectionChannelOutputs } from './channels/inspectionChannels.js';
import { recordChannels, type RecordChannelOutputs } from './channels/recordChannels.js';
import { sourceChannels, type SourceChannelOutputs } from './channels/sourceChannels.js';
import { settingsChannels, type SettingsChannelOutputs } from './channels/settingsChannels.js';

export const channels = {
  ...planChannels,
  ...inspectionChannels,
  ...recordChannels,
  ...sourceChannels,
  ...settingsChannels,
} as const;

export type ChannelName = keyof typeof channels;

/** What the renderer sends on a channel. */
export type ChannelInput<C extends ChannelName> = z.input<(typeof channels)[C]['input']>;

/** What the handler receives once the schema has accepted the payload. */
export type ChannelParsedInput<C extends ChannelName> = z.output<(typeof channels)[C]['input']>;

export interface ChannelOutputs extends PlanChannelOutputs, InspectionChannelOutputs, RecordChannelOutputs, SourceChannelOutputs, SettingsChannelOutputs {}

/** What a channel answers with when it succeeds. */
export type ChannelOutput<C extends ChannelName> = ChannelOutputs[C];

export const channelNames = Object.keys(channels) as ChannelName[];

export function isChannelName(name: string): name is ChannelName {
  return Object.hasOwn(channels, name);
}
