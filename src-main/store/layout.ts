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

const SAFE_ID = /^[A-Za-z0-9][A-Za-z0-9._-]{0,79}$/;

/** Ids become file names: refuse anything that could leave its folder. */
export function checkId(kind: string, id: string): string {
  if (!SAFE_ID.test(id) || id.includes('..')) {
    throw new Error(`${kind} id ${JSON.stringify(id)} is not allowed: use letters, digits, ".", "_" or "-" (at most 80)`);
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
