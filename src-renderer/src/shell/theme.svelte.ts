/**
 * Light or dark. The choice is the `theme` setting (system, light or dark) in the data folder's
 * settings, the same in the desktop window and the browser; "system" follows the operating
 * system, also when it changes while the app is open. The last choice is cached per machine so
 * the first paint already has it.
 */
import { request } from '../lib/channelClient';

export type ThemeName = 'light' | 'dark';
export type ThemeSetting = 'system' | 'light' | 'dark';

const cacheKey = 'tallyline.theme';
const systemDark = matchMedia('(prefers-color-scheme: dark)');

class Theme {
  setting = $state<ThemeSetting>(cachedSetting());
  private systemIsDark = $state(systemDark.matches);
  current = $derived<ThemeName>(this.setting === 'system' ? (this.systemIsDark ? 'dark' : 'light') : this.setting);

  constructor() {
    systemDark.addEventListener('change', (event) => {
      this.systemIsDark = event.matches;
      apply(this.current);
    });
    apply(this.current);
    void request('settings.get', null).then((result) => {
      if (result.ok) this.follow(result.value.theme);
    });
  }

  /** Switches between light and dark and saves the choice as the `theme` setting. */
  toggle(): void {
    const next: ThemeName = this.current === 'light' ? 'dark' : 'light';
    this.follow(next);
    void request('settings.update', { theme: next });
  }

  private follow(setting: ThemeSetting): void {
    this.setting = setting;
    localStorage.setItem(cacheKey, setting);
    apply(this.current);
  }
}

function cachedSetting(): ThemeSetting {
  const cached = localStorage.getItem(cacheKey);
  return cached === 'dark' || cached === 'light' || cached === 'system' ? cached : 'system';
}

function apply(theme: ThemeName): void {
  document.documentElement.dataset.theme = theme;
}

export const theme = new Theme();
