/** Light or dark, remembered per machine; follows the system until the user picks one. */
export type ThemeName = 'light' | 'dark';

const storageKey = 'tallyline.theme';

class Theme {
  current = $state<ThemeName>(initialTheme());

  toggle(): void {
    this.current = this.current === 'light' ? 'dark' : 'light';
    localStorage.setItem(storageKey, this.current);
    apply(this.current);
  }
}

function initialTheme(): ThemeName {
  const saved = localStorage.getItem(storageKey);
  const theme: ThemeName = saved === 'dark' || saved === 'light' ? saved : matchMedia('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
  apply(theme);
  return theme;
}

function apply(theme: ThemeName): void {
  document.documentElement.dataset.theme = theme;
}

export const theme = new Theme();
