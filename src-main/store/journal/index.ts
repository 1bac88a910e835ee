export * from './format.js';
export * from './analyse.js';
export * from './verify.js';
export * from './writer.js';
export * from './errors.js';
export { quarantinePathFor, type QuarantineRecord } from './quarantine.js';
export { isAlive as processIsAlive, journalHolder } from './lock.js';
