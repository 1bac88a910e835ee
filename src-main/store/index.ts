/** Durable storage: the data directory, atomic files, run journals, and the repositories. */
export * from './dataDirectory.js';
export { writeFileAtomic, writeFileOnce, syncFolder } from './atomicWrite.js';
export * from './journal/index.js';
export { layout, checkId } from './layout.js';
export { StoreFileError } from './jsonFile.js';
export { planSpecSchema } from './planSpecSchema.js';
export * from './sources.js';
export * from './plans.js';
export * from './settings.js';
export { newId } from './ids.js';
export { folderNames } from './folderNames.js';
