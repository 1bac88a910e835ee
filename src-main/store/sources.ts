/**
 * The source register: suppliers, lines and machines, with their parts and characteristics.
 * Sources are created, renamed and retired, never deleted: runs refer to them by id.
 */
import { folderNames } from './folderNames.js';
import { z } from 'zod';
import { newId } from './ids.js';
import { readJsonFile, writeJsonFile } from './jsonFile.js';
import { layout } from './layout.js';

export const SOURCE_FORMAT = 'tallyline.source/1';

const partSchema = z.object({
  name: z.string().min(1),
  characteristics: z.array(z.string().min(1)),
});

export const sourceSchema = z.object({
  format: z.literal(SOURCE_FORMAT),
  id: z.string().min(1),
  name: z.string().min(1),
  kind: z.enum(['supplier', 'line', 'machine']),
  parts: z.array(partSchema),
  retired: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export type Source = z.infer<typeof sourceSchema>;
export type SourceKind = Source['kind'];
export type SourcePart = z.infer<typeof partSchema>;

export interface NewSource {
  readonly name: string;
  readonly kind?: SourceKind;
  readonly parts?: readonly SourcePart[];
}

export class SourceRepository {
  constructor(
    private readonly dataDirectory: string,
    private readonly clock: () => Date = () => new Date(),
  ) {}

  async list(options: { includeRetired?: boolean } = {}): Promise<Source[]> {
    const names = await folderNames(layout.sourcesFolder(this.dataDirectory));
    const ids = names.filter((name) => name.endsWith('.json') && !name.startsWith('.')).map((name) => name.slice(0, -5));
    const sources = await Promise.all(ids.map((id) => this.get(id)));
    return sources
      .filter((source) => options.includeRetired === true || !source.retired)
      .sort((a, b) => a.name.localeCompare(b.name));
  }

  get(id: string): Promise<Source> {
    return readJsonFile(layout.sourceFile(this.dataDirectory, id), sourceSchema);
  }

  /** The active source with this name (case-insensitive), if any. */
  async findByName(name: string): Promise<Source | undefined> {
    const wanted = name.trim().toLowerCase();
    return (await this.list()).find((source) => source.name.toLowerCase() === wanted);
  }

  async create(input: NewSource): Promise<Source> {
    const name = await this.checkNameFree(input.name);
    const now = this.clock().toISOString();
    const source: Source = {
      format: SOURCE_FORMAT,
      id: newId('src', this.clock()),
      name,
      kind: input.kind ?? 'supplier',
      parts: (input.parts ?? []).map((part) => ({ name: part.name, characteristics: [...part.characteristics] })),
      retired: false,
      createdAt: now,
      updatedAt: now,
    };
    await this.save(source);
    return source;
  }

  /** The active source with this name, created as a supplier when there is none. */
  async findOrCreate(name: string): Promise<{ source: Source; created: boolean }> {
    const found = await this.findByName(name);
    return found !== undefined ? { source: found, created: false } : { source: await this.create({ name }), created: true };
  }

  async rename(id: string, newName: string): Promise<Source> {
    const source = await this.get(id);
    const name = await this.checkNameFree(newName, id);
    return this.save({ ...source, name, updatedAt: this.clock().toISOString() });
  }

  async setParts(id: string, parts: readonly SourcePart[]): Promise<Source> {
    const source = await this.get(id);
    return this.save({ ...source, parts: parts.map((part) => ({ ...part })), updatedAt: this.clock().toISOString() });
  }

  /** Retired sources stay on disk for the runs that refer to them, but are no longer offered. */
  async retire(id: string): Promise<Source> {
    const source = await this.get(id);
    return this.save({ ...source, retired: true, updatedAt: this.clock().toISOString() });
  }

  private async save(source: Source): Promise<Source> {
    const checked = sourceSchema.parse(source);
    await writeJsonFile(layout.sourceFile(this.dataDirectory, checked.id), checked);
    return checked;
  }

  private async checkNameFree(name: string, exceptId?: string): Promise<string> {
    const trimmed = name.trim();
    if (trimmed === '') throw new Error('a source needs a name');
    const holder = await this.findByName(trimmed);
    if (holder !== undefined && holder.id !== exceptId) {
      throw new Error(`a source named ${JSON.stringify(holder.name)} already exists (${holder.id})`);
    }
    return trimmed;
  }
}
