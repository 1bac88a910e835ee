/**
 * The on-disk layout of the data directory, in one place:
 *
 *   <data>/settings.json                      tallyline.settings/1
 *   <data>/sources/<sourceId>.json            tallyline.source/1
 *   <data>/plans/<planId>/v<version>.json     tallyline.plan/1 (write-once)
 *   <data>/runs/<runId>.journal               tallyline.journal/1 (append-only JSON lines)
 *   <data>/runs/<runId>.quarantine            torn tails cut off that journal
 *   <data>/runs/<runId>.lock                  pid of the process writing that journal
 */
import path from 'node:path';
import { ID_ALLOWED, ID_PATTERN } from './ids.js';

/** Ids become file names: refuse anything that could leave its folder. */
export function checkId(kind: string, id: string): string {
  if (!ID_PATTERN.test(id)) {
    throw new Error(`${kind} id ${JSON.stringify(id)} is not allowed: use ${ID_ALLOWED}`);
  }
  return id;
}

export const layout = {
  settingsFile: (data: string): string => path.join(data, 'settings.json'),
  sourcesFolder: (data: string): string => path.join(data, 'sources'),
  sourceFile: (data: string, sourceId: string): string => path.join(data, 'sources', `${checkId('source', sourceId)}.json`),
  plansFolder: (data: string): string => path.join(data, 'plans'),
  planFolder: (data: string, planId: string): string => path.join(data, 'plans', checkId('plan', planId)),
  planVersionFile: (data: string, planId: string, version: number): string =>
    path.join(data, 'plans', checkId('plan', planId), `v${version}.json`),
  runsFolder: (data: string): string => path.join(data, 'runs'),
  runJournal: (data: string, runId: string): string => path.join(data, 'runs', `${checkId('run', runId)}.journal`),
};
