export * from './format.js';
export * from './analyse.js';
export * from './verify.js';
export * from './writer.js';
export * from './errors.js';
export { quarantinePathFor, type QuarantineRecord } from './quarantine.js';
export { liveLockOwner, lockPathFor, type LockOwner } from './lock.js';
export * from './anchor.js';
