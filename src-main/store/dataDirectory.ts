/**
 * Where Tallyline keeps its durable data (run journals, plans, sources, settings).
 *
 * Order of precedence: the `--data-dir DIR` (or `--data-dir=DIR`) flag, then the
 * `TALLYLINE_DATA` environment variable, then the operating system's per-user
 * application-data folder.
 */
import path from 'node:path';

export interface DataDirectoryInputs {
  /** Command-line arguments (only `--data-dir` is looked at). */
  readonly argv: readonly string[];
  /** Environment variables. */
  readonly env: Readonly<Record<string, string | undefined>>;
  /** `process.platform` value. */
  readonly platform: NodeJS.Platform | string;
  /** The user's home folder. */
  readonly home: string;
}

export const APP_FOLDER_NAME = 'Tallyline';
/**
 * On macOS and Windows, Electron keeps its own profile (caches, cookies, the single-instance lock)
 * in `<app data>/Tallyline`; the data sit beside it in a folder of their own, so a restore that
 * swaps the data folder never moves the live profile and no Chromium file lands among the data.
 * (On Linux the profile is under ~/.config and the data under ~/.local/share already.)
 */
export const DESKTOP_DATA_FOLDER_NAME = 'Tallyline Data';

/** The value of `--data-dir`, or undefined when the flag is absent. Throws when it has no value. */
export function dataDirectoryFlag(argv: readonly string[]): string | undefined {
  for (let index = 0; index < argv.length; index += 1) {
    const argument = argv[index];
    if (argument === '--data-dir') {
      const value = argv[index + 1];
      if (value === undefined || value === '' || value.startsWith('--')) {
        throw new Error('--data-dir needs a folder, e.g. --data-dir ./tallyline-data');
      }
      return value;
    }
    if (argument.startsWith('--data-dir=')) {
      const value = argument.slice('--data-dir='.length);
      if (value === '') throw new Error('--data-dir needs a folder, e.g. --data-dir=./tallyline-data');
      return value;
    }
  }
  return undefined;
}

/** The per-user application-data folder for Tallyline on this platform. */
export function platformDataDirectory(
  platform: DataDirectoryInputs['platform'],
  env: DataDirectoryInputs['env'],
  home: string,
): string {
  if (platform === 'win32') {
    const appData = nonEmpty(env.APPDATA) ?? path.win32.join(home, 'AppData', 'Roaming');
    return path.win32.join(appData, DESKTOP_DATA_FOLDER_NAME);
  }
  if (platform === 'darwin') {
    return path.posix.join(home, 'Library', 'Application Support', DESKTOP_DATA_FOLDER_NAME);
  }
  const xdg = nonEmpty(env.XDG_DATA_HOME);
  // XDG Base Directory spec: a relative XDG_DATA_HOME is invalid and must be ignored.
  const base = xdg !== undefined && path.posix.isAbsolute(xdg) ? xdg : path.posix.join(home, '.local', 'share');
  return path.posix.join(base, APP_FOLDER_NAME);
}

/** Resolve the data directory: flag, then TALLYLINE_DATA, then the OS app-data folder. */
export function resolveDataDirectory(inputs: DataDirectoryInputs): string {
  const fromFlag = dataDirectoryFlag(inputs.argv);
  if (fromFlag !== undefined) return path.resolve(fromFlag);
  const fromEnv = nonEmpty(inputs.env.TALLYLINE_DATA);
  if (fromEnv !== undefined) return path.resolve(fromEnv);
  return platformDataDirectory(inputs.platform, inputs.env, inputs.home);
}

function nonEmpty(value: string | undefined): string | undefined {
  return value === undefined || value.trim() === '' ? undefined : value;
}
