import type { MenuItemConstructorOptions } from 'electron';

export interface MenuActions {
  /** Shows the About box (version, data folder, licence); macOS has it in the app menu instead. */
  showAbout: () => void;
}

/**
 * The application menu: standard roles, and on Windows and Linux a Help menu with About (macOS
 * puts About in the app menu, filled by app.setAboutPanelOptions). The app's own commands live in its window.
 */
export function buildMenuTemplate(platform: NodeJS.Platform, actions: MenuActions): MenuItemConstructorOptions[] {
  const appMenu: MenuItemConstructorOptions[] = platform === 'darwin' ? [{ role: 'appMenu' }] : [];
  const helpMenu: MenuItemConstructorOptions[] =
    platform === 'darwin' ? [] : [{ role: 'help', submenu: [{ label: 'About Tallyline', click: () => actions.showAbout() }] }];
  return [
    ...appMenu,
    { role: 'fileMenu' },
    { role: 'editMenu' },
    {
      label: 'View',
      submenu: [{ role: 'reload' }, { role: 'resetZoom' }, { role: 'zoomIn' }, { role: 'zoomOut' }, { type: 'separator' }, { role: 'togglefullscreen' }],
    },
    { role: 'windowMenu' },
    ...helpMenu,
  ];
}
