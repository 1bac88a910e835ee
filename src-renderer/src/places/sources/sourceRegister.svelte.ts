/**
 * The source register as the Sources place sees it: the sources with their run counts, the one
 * chosen and its summary. Every change goes through the source channels.
 */
import type { SourceListItem, SourceSummaryView } from '../../../../src-main/api/channels/sourceChannels';
import type { SourceKind, SourcePart } from '../../../../src-main/store/sources';
import { request } from '../../lib/channelClient';

export type { SourceKind, SourcePart };

export class SourceRegister {
  sources = $state.raw<SourceListItem[]>([]);
  showRetired = $state(false);
  selectedId = $state<string | null>(null);
  summary = $state.raw<SourceSummaryView | null>(null);
  problem = $state<string | null>(null);
  /** Whether the list was read at least once (the first-run offer waits for it). */
  loaded = $state(false);

  readonly selected = $derived(this.sources.find((source) => source.id === this.selectedId) ?? null);

  async refresh(): Promise<void> {
    const result = await request('source.list', { includeRetired: this.showRetired });
    this.loaded = true;
    if (!result.ok) {
      this.problem = result.message;
      return;
    }
    this.sources = result.value;
    if (this.selectedId === null || !this.sources.some((source) => source.id === this.selectedId)) {
      this.selectedId = this.sources[0]?.id ?? null;
    }
    await this.loadSummary();
  }

  async select(id: string): Promise<void> {
    this.selectedId = id;
    await this.loadSummary();
  }

  async create(name: string, kind: SourceKind): Promise<boolean> {
    const result = await request('source.create', { name, kind, parts: [] });
    if (!result.ok) return this.fail(result.message);
    this.selectedId = result.value.id;
    await this.refresh();
    return true;
  }

  async rename(name: string): Promise<boolean> {
    if (this.selectedId === null) return false;
    const result = await request('source.rename', { id: this.selectedId, name });
    if (!result.ok) return this.fail(result.message);
    await this.refresh();
    return true;
  }

  async setParts(parts: SourcePart[]): Promise<boolean> {
    if (this.selectedId === null) return false;
    const result = await request('source.setParts', { id: this.selectedId, parts });
    if (!result.ok) return this.fail(result.message);
    await this.refresh();
    return true;
  }

  async retire(): Promise<boolean> {
    if (this.selectedId === null) return false;
    const result = await request('source.retire', { id: this.selectedId });
    if (!result.ok) return this.fail(result.message);
    if (!this.showRetired) this.selectedId = null;
    await this.refresh();
    return true;
  }

  async fillWithDemo(): Promise<boolean> {
    const result = await request('source.demo', null);
    if (!result.ok) return this.fail(result.message);
    await this.refresh();
    return true;
  }

  private async loadSummary(): Promise<void> {
    if (this.selectedId === null) {
      this.summary = null;
      return;
    }
    const result = await request('source.summary', { id: this.selectedId });
    this.summary = result.ok ? result.value : null;
    this.problem = result.ok ? null : result.message;
  }

  private fail(message: string): false {
    this.problem = message;
    return false;
  }
}
