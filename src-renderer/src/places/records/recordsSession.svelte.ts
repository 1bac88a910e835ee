/**
 * The Records place's state: the history with its filters, and the one run opened read-only.
 * Files (the record PDF, the entries CSV) are made on the main side and handed to the user as
 * downloads, which works the same in the browser host and in Electron's renderer.
 */
import { request } from '../../lib/channelClient';
import type { RecordRunView, RunHistory } from '../../../../src-main/api/channels/recordChannels';
import type { RunOutcome } from '../../../../src-main/inspection/runOutcome';
import { downloadBase64, downloadText } from '../../lib/download';

export interface HistoryFilterState {
  sourceId: string;
  from: string;
  to: string;
  outcome: RunOutcome | '';
}

export class RecordsSession {
  filter = $state<HistoryFilterState>({ sourceId: '', from: '', to: '', outcome: '' });
  history = $state.raw<RunHistory | null>(null);
  problem = $state<string | null>(null);
  loading = $state(false);
  view = $state.raw<RecordRunView | null>(null);
  opening = $state(false);
  /** What the last file request did, for a status line: "Downloaded record-….pdf" or the refusal. */
  fileStatus = $state<{ ok: boolean; message: string } | null>(null);
  busyFile = $state<'pdf' | 'csv' | null>(null);
  private generation = 0;

  /** Asks for the history with the current filters; an older answer arriving late is dropped. */
  async refresh(): Promise<void> {
    const { sourceId, from, to, outcome } = this.filter;
    const mine = ++this.generation;
    this.loading = true;
    const result = await request('record.history', {
      ...(sourceId ? { sourceId } : {}),
      ...(from ? { from } : {}),
      ...(to ? { to } : {}),
      ...(outcome ? { outcome } : {}),
    });
    if (mine !== this.generation) return;
    this.loading = false;
    if (result.ok) {
      this.history = result.value;
      this.problem = null;
    } else {
      this.problem = result.message;
    }
  }

  clearFilters(): void {
    this.filter = { sourceId: '', from: '', to: '', outcome: '' };
  }

  async open(runId: string): Promise<void> {
    this.opening = true;
    this.fileStatus = null;
    const result = await request('record.open', { runId });
    this.opening = false;
    if (result.ok) {
      this.view = result.value;
      this.problem = null;
    } else {
      this.problem = result.message;
    }
  }

  leave(): void {
    this.view = null;
    this.fileStatus = null;
  }

  async downloadRecord(runId: string): Promise<void> {
    this.busyFile = 'pdf';
    const result = await request('record.pdf', { runId });
    this.busyFile = null;
    if (!result.ok) {
      this.fileStatus = { ok: false, message: result.message };
      return;
    }
    const interim = result.value.interim ? ' (interim: the run is not decided)' : '';
    const desktop = window.tallylineDesktop;
    if (desktop) {
      // In the desktop window the record opens in the system PDF viewer, which prints it.
      const opened = await desktop.openRecordPdf(result.value.fileName, result.value.base64);
      this.fileStatus = opened.ok
        ? { ok: true, message: `Opened ${result.value.fileName}${interim} in your PDF viewer; print it from there.` }
        : { ok: false, message: opened.message };
      return;
    }
    downloadBase64(result.value.fileName, result.value.base64, 'application/pdf');
    this.fileStatus = { ok: true, message: `Downloaded ${result.value.fileName}${interim}.` };
  }

  async downloadEntries(runId: string): Promise<void> {
    this.busyFile = 'csv';
    const result = await request('record.csv', { runId });
    this.busyFile = null;
    if (!result.ok) {
      this.fileStatus = { ok: false, message: result.message };
      return;
    }
    downloadText(result.value.fileName, result.value.text, 'text/csv;charset=utf-8');
    this.fileStatus = { ok: true, message: `Downloaded ${result.value.fileName}.` };
  }
}

export const recordsSession = new RecordsSession();
