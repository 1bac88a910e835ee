/**
 * The desktop window's size and position, remembered between launches in the desktop profile
 * (`<userData>/window-state.json`, beside Chromium's own files, not among the data), checked with
 * zod when read and fitted onto a display that exists now before the window is opened.
 */
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { readJsonFileIfPresent } from '../store/jsonFile.js';

export const WINDOW_STATE_FORMAT = 'tallyline.window/1';
export const WINDOW_STATE_FILE_NAME = 'window-state.json';

export interface Rectangle {
  x: number;
  y: number;
  width: number;
  height: number;
}

const pixels = z.number().int().min(-100_000).max(100_000);
const size = z.number().int().min(1).max(100_000);

export const windowStateSchema = z.object({
  format: z.literal(WINDOW_STATE_FORMAT),
  x: pixels,
  y: pixels,
  width: size,
  height: size,
  maximized: z.boolean(),
});

export type WindowState = z.infer<typeof windowStateSchema>;

/** The window's first size, and the least it may be made (the places need this much room). */
export const DEFAULT_WINDOW_SIZE = { width: 1280, height: 800 } as const;
export const MINIMUM_WINDOW_SIZE = { width: 960, height: 640 } as const;

export function windowStateFile(userDataFolder: string): string {
  return path.join(userDataFolder, WINDOW_STATE_FILE_NAME);
}

/** The remembered state, or null when there is none or it is not a valid state file (then the window opens at its default place). */
export async function readWindowState(file: string, warn: (line: string) => void = () => undefined): Promise<WindowState | null> {
  try {
    return (await readJsonFileIfPresent(file, windowStateSchema)) ?? null;
  } catch (error) {
    warn(`Window position not restored: ${(error as Error).message}`);
    return null;
  }
}

/**
 * Saves the state synchronously, replacing the file by rename so a crash leaves the old or the new
 * one. Synchronous on purpose: the window's close is the last moment, and on quit the process ends
 * right after it. (Window state is not data: no fsync.)
 */
export function writeWindowStateNow(file: string, bounds: Rectangle, maximized: boolean): void {
  const state: WindowState = windowStateSchema.parse({ format: WINDOW_STATE_FORMAT, ...roundRectangle(bounds), maximized });
  mkdirSync(path.dirname(file), { recursive: true });
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, `${JSON.stringify(state, null, 2)}\n`);
  renameSync(temporary, file);
}

function roundRectangle(rectangle: Rectangle): Rectangle {
  return { x: Math.round(rectangle.x), y: Math.round(rectangle.y), width: Math.round(rectangle.width), height: Math.round(rectangle.height) };
}

function overlapArea(a: Rectangle, b: Rectangle): number {
  const width = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const height = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
  return width > 0 && height > 0 ? width * height : 0;
}

function clamp(value: number, low: number, high: number): number {
  return Math.min(Math.max(value, low), high);
}

/**
 * Where the window opens: the remembered bounds moved and shrunk onto the display they overlap
 * most, so a window left on a monitor that is gone (or partly off-screen) opens wholly visible.
 * Without a remembered state, or when it overlaps no display, the default size centred on the
 * primary display; a window left maximized opens maximized. Never smaller than the minimum unless the display itself is smaller.
 *
 * @param workAreas the displays' work areas (without task bars); the first is the primary display.
 */
export function fitWindowToDisplays(state: WindowState | null, workAreas: readonly Rectangle[]): Rectangle & { maximized: boolean } {
  const primary = workAreas[0] ?? { x: 0, y: 0, ...DEFAULT_WINDOW_SIZE };
  let area = primary;
  let wanted: Rectangle | null = null;
  if (state !== null) {
    let best = 0;
    for (const candidate of workAreas) {
      const overlap = overlapArea(state, candidate);
      if (overlap > best) {
        best = overlap;
        area = candidate;
      }
    }
    if (best > 0) wanted = state;
  }
  const width = Math.min(area.width, Math.max(MINIMUM_WINDOW_SIZE.width, wanted?.width ?? DEFAULT_WINDOW_SIZE.width));
  const height = Math.min(area.height, Math.max(MINIMUM_WINDOW_SIZE.height, wanted?.height ?? DEFAULT_WINDOW_SIZE.height));
  const x = wanted === null ? area.x + Math.round((area.width - width) / 2) : clamp(wanted.x, area.x, area.x + area.width - width);
  const y = wanted === null ? area.y + Math.round((area.height - height) / 2) : clamp(wanted.y, area.y, area.y + area.height - height);
  return { x, y, width, height, maximized: state?.maximized ?? false };
}
