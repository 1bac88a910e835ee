/** The history of sources: their runs summed up. */
export * from './sourceSummary.js';
