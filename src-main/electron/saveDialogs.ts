import path from 'node:path';

/** What the save dialog of a file the app hands over looks like (Electron's SaveDialogOptions subset). */
export interface SaveDialogSettings {
  title: string;
  defaultPath: string;
  filters: Array<{ name: string; extensions: string[] }>;
}

const kinds: Record<string, { title: string; filter: string }> = {
  '.json': { title: 'Save plan file', filter: 'Tallyline plan (JSON)' },
  '.csv': { title: 'Save CSV', filter: 'CSV (comma-separated values)' },
  '.pdf': { title: 'Save decision record', filter: 'PDF document' },
  '.tallyline-archive': { title: 'Save backup', filter: 'Tallyline backup' },
  '.txt': { title: 'Save text', filter: 'Text' },
};

/**
 * The native Save dialog for a file the window offers (a plan file, a CSV, a decision record, a
 * backup): a title and a filter for its kind, proposed in the user's documents folder. The
 * renderer offers every file as a download, as in the browser host; the desktop shell turns
 * each download into this dialog.
 */
export function saveDialogFor(fileName: string, documentsFolder: string): SaveDialogSettings {
  const safeName = path.basename(fileName);
  const extension = safeName.endsWith('.tallyline-archive') ? '.tallyline-archive' : path.extname(safeName).toLowerCase();
  const kind = kinds[extension];
  const filters = kind ? [{ name: kind.filter, extensions: [extension.slice(1)] }] : [];
  return {
    title: kind?.title ?? 'Save file',
    defaultPath: path.join(documentsFolder, safeName),
    filters: [...filters, { name: 'All files', extensions: ['*'] }],
  };
}
