/** Backup and restore of the whole data folder as one `tallyline.archive/1` file. */
export * from './archiveFormat.js';
export { exportArchive, type ExportedArchive } from './exportArchive.js';
export { unpackArchive, type UnpackedArchive } from './readArchive.js';
export { restoreArchive, type RestoreReport, type RestoreOptions } from './restoreArchive.js';
