import type { MenuItemConstructorOptions } from 'electron';

/** The parts of Electron's context-menu parameters the menu depends on. */
export interface ContextMenuParameters {
  isEditable: boolean;
  selectionText: string;
  editFlags: { canCut: boolean; canCopy: boolean; canPaste: boolean; canSelectAll: boolean };
}

/**
 * The right-click menu: in a text field, Cut, Copy, Paste and Select All (each enabled only when it
 * can act); on selected text elsewhere, Copy; nothing otherwise (the app's commands live in its window).
 */
export function contextMenuTemplate(parameters: ContextMenuParameters): MenuItemConstructorOptions[] | null {
  const flags = parameters.editFlags;
  if (parameters.isEditable) {
    return [
      { role: 'cut', enabled: flags.canCut },
      { role: 'copy', enabled: flags.canCopy },
      { role: 'paste', enabled: flags.canPaste },
      { type: 'separator' },
      { role: 'selectAll', enabled: flags.canSelectAll },
    ];
  }
  if (parameters.selectionText.trim() !== '') return [{ role: 'copy', enabled: flags.canCopy }];
  return null;
}
