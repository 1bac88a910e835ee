/**
 * A small reader of PDF objects, for reading back the files Tallyline writes (decision records):
 * numbered objects, their values, and their streams (FlateDecode inflated with node:zlib).
 * No native parts and no PDF library. It reads plain (non-compressed) cross-reference layouts by
 * scanning for `N G obj` headers, which is what pdfkit writes; object streams and encryption,
 * which pdfkit does not use, are not read.
 *
 * References: ISO 32000-1:2008 (PDF 1.7) §7.2 lexical conventions, §7.3 objects, §7.4.4
 * FlateDecode (from memory).
 */
import { inflateSync } from 'node:zlib';

export type PdfValue = number | boolean | null | PdfName | PdfString | PdfReference | PdfValue[] | PdfDictionary;

export interface PdfName {
  readonly kind: 'name';
  readonly name: string;
}

export interface PdfString {
  readonly kind: 'string';
  /** The string's bytes (literal escapes and hex digits decoded). */
  readonly bytes: Uint8Array;
}

export interface PdfReference {
  readonly kind: 'ref';
  readonly number: number;
}

export interface PdfDictionary {
  readonly kind: 'dict';
  readonly entries: ReadonlyMap<string, PdfValue>;
}

export interface PdfObject {
  readonly number: number;
  readonly value: PdfValue;
  /** The raw (still encoded) bytes of the object's stream, when it has one. */
  readonly stream: Uint8Array | null;
}

const WHITESPACE = new Set([0x00, 0x09, 0x0a, 0x0c, 0x0d, 0x20]);
const DELIMITERS = new Set([0x28, 0x29, 0x3c, 0x3e, 0x5b, 0x5d, 0x7b, 0x7d, 0x2f, 0x25]);

/** Reads PDF values from bytes; also used for content streams, whose operators come back as keywords. */
export class PdfLexer {
  position: number;

  constructor(
    readonly bytes: Uint8Array,
    start = 0,
  ) {
    this.position = start;
  }

  skipWhitespace(): void {
    const bytes = this.bytes;
    while (this.position < bytes.length) {
      const byte = bytes[this.position];
      if (WHITESPACE.has(byte)) this.position += 1;
      else if (byte === 0x25) {
        while (this.position < bytes.length && bytes[this.position] !== 0x0a && bytes[this.position] !== 0x0d) this.position += 1;
      } else break;
    }
  }

  /** The next value, or a bare keyword (`obj`, `stream`, `R`, an operator) as `{ keyword }`; null at the end. */
  next(): PdfValue | { keyword: string } | null {
    this.skipWhitespace();
    const bytes = this.bytes;
    if (this.position >= bytes.length) return null;
    const byte = bytes[this.position];
    if (byte === 0x2f) return { kind: 'name', name: this.regularRun(this.position + 1) };
    if (byte === 0x28) return this.literalString();
    if (byte === 0x3c && bytes[this.position + 1] === 0x3c) {
      this.position += 2;
      return this.dictionary();
    }
    if (byte === 0x3c) return this.hexString();
    if (byte === 0x5b) {
      this.position += 1;
      return this.array();
    }
    if (byte === 0x5d || byte === 0x3e) {
      this.position += byte === 0x3e ? 2 : 1;
      return { keyword: byte === 0x3e ? '>>' : ']' };
    }
    const word = this.regularRun(this.position);
    if (word === '') {
      this.position += 1;
      return { keyword: String.fromCharCode(byte) };
    }
    if (/^[+-]?(\d+\.?\d*|\.\d+)$/.test(word)) return Number(word);
    if (word === 'true' || word === 'false') return word === 'true';
    if (word === 'null') return null;
    return { keyword: word };
  }

  /** The next value, with `N G R` read as a reference. */
  value(): PdfValue | { keyword: string } | null {
    const first = this.next();
    if (typeof first !== 'number' || !Number.isInteger(first)) return first;
    const saved = this.position;
    const second = this.next();
    const third = this.next();
    if (typeof second === 'number' && isKeyword(third, 'R')) return { kind: 'ref', number: first };
    this.position = saved;
    return first;
  }

  private regularRun(start: number): string {
    const bytes = this.bytes;
    let end = start;
    let word = '';
    while (end < bytes.length && !WHITESPACE.has(bytes[end]) && !DELIMITERS.has(bytes[end])) word += String.fromCharCode(bytes[end++]);
    this.position = end;
    return word;
  }

  private array(): PdfValue[] {
    const items: PdfValue[] = [];
    for (;;) {
      const item = this.value();
      if (item === null || isKeyword(item, ']')) return items;
      if (!isKeywordValue(item)) items.push(item);
    }
  }

  private dictionary(): PdfDictionary {
    const entries = new Map<string, PdfValue>();
    for (;;) {
      const key = this.next();
      if (key === null || isKeyword(key, '>>')) return { kind: 'dict', entries };
      if (isKeywordValue(key) || key === null || typeof key !== 'object' || Array.isArray(key) || key.kind !== 'name') continue;
      const item = this.value();
      if (item === null || isKeyword(item, '>>')) return { kind: 'dict', entries };
      if (!isKeywordValue(item)) entries.set(key.name, item);
    }
  }

  private hexString(): PdfString {
    const bytes = this.bytes;
    const out: number[] = [];
    let high = -1;
    let index = this.position + 1;
    for (; index < bytes.length && bytes[index] !== 0x3e; index++) {
      const digit = hexDigit(bytes[index]);
      if (digit < 0) continue;
      if (high < 0) high = digit;
      else {
        out.push(high * 16 + digit);
        high = -1;
      }
    }
    if (high >= 0) out.push(high * 16);
    this.position = index + 1;
    return { kind: 'string', bytes: Uint8Array.from(out) };
  }

  private literalString(): PdfString {
    const bytes = this.bytes;
    const out: number[] = [];
    let depth = 0;
    this.position += 1;
    while (this.position < bytes.length) {
      const byte = bytes[this.position++];
      if (byte === 0x5c) {
        const escaped = bytes[this.position++];
        const simple: Record<number, number> = { 0x6e: 0x0a, 0x72: 0x0d, 0x74: 0x09, 0x62: 0x08, 0x66: 0x0c };
        if (escaped >= 0x30 && escaped <= 0x37) {
          let octal = escaped - 0x30;
          for (let digits = 1; digits < 3 && bytes[this.position] >= 0x30 && bytes[this.position] <= 0x37; digits++) octal = octal * 8 + (bytes[this.position++] - 0x30);
          out.push(octal & 0xff);
        } else if (escaped === 0x0d || escaped === 0x0a) {
          if (escaped === 0x0d && bytes[this.position] === 0x0a) this.position += 1;
        } else out.push(simple[escaped] ?? escaped);
      } else if (byte === 0x28) {
        depth += 1;
        out.push(byte);
      } else if (byte === 0x29) {
        if (depth === 0) break;
        depth -= 1;
        out.push(byte);
      } else out.push(byte);
    }
    return { kind: 'string', bytes: Uint8Array.from(out) };
  }
}

function hexDigit(byte: number): number {
  if (byte >= 0x30 && byte <= 0x39) return byte - 0x30;
  if (byte >= 0x61 && byte <= 0x66) return byte - 0x57;
  if (byte >= 0x41 && byte <= 0x46) return byte - 0x37;
  return -1;
}

function isKeywordValue(value: unknown): value is { keyword: string } {
  return typeof value === 'object' && value !== null && 'keyword' in value;
}

export function isKeyword(value: unknown, keyword: string): boolean {
  return isKeywordValue(value) && value.keyword === keyword;
}

const OBJECT_HEADER = /(\d+)\s+(\d+)\s+obj\b/g;

/**
 * Every numbered object of a PDF, by object number (a later definition of a number replaces an
 * earlier one, as an incremental update does). Streams are skipped by their /Length, so bytes
 * inside them are never mistaken for object headers.
 */
export function readPdfObjects(pdf: Uint8Array): Map<number, PdfObject> {
  const bytes = pdf;
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1');
  const objects = new Map<number, PdfObject>();
  OBJECT_HEADER.lastIndex = 0;
  for (let match = OBJECT_HEADER.exec(text); match !== null; match = OBJECT_HEADER.exec(text)) {
    const lexer = new PdfLexer(bytes, match.index + match[0].length);
    const value = lexer.value();
    if (value === null || isKeywordValue(value)) continue;
    let stream: Uint8Array | null = null;
    const after = lexer.position;
    const keyword = lexer.next();
    if (isKeyword(keyword, 'stream') && isDictionary(value)) {
      let start = lexer.position;
      if (bytes[start] === 0x0d) start += 1;
      if (bytes[start] === 0x0a) start += 1;
      const declared = value.entries.get('Length');
      const endMarker = text.indexOf('endstream', start);
      const length = typeof declared === 'number' && start + declared <= bytes.length ? declared : Math.max(0, (endMarker < 0 ? bytes.length : endMarker) - start);
      stream = bytes.subarray(start, start + length);
      OBJECT_HEADER.lastIndex = start + length;
    } else {
      OBJECT_HEADER.lastIndex = after;
    }
    objects.set(Number(match[1]), { number: Number(match[1]), value, stream });
  }
  return objects;
}

export function isDictionary(value: PdfValue | undefined): value is PdfDictionary {
  return typeof value === 'object' && value !== null && !Array.isArray(value) && value.kind === 'dict';
}

export function isName(value: PdfValue | undefined, name?: string): value is PdfName {
  return typeof value === 'object' && value !== null && !Array.isArray(value) && value.kind === 'name' && (name === undefined || value.name === name);
}

/** Follows a reference (once, or through a chain) to the value it names; other values come back as they are. */
export function resolve(objects: ReadonlyMap<number, PdfObject>, value: PdfValue | undefined): PdfValue | undefined {
  let current = value;
  for (let hops = 0; hops < 32 && typeof current === 'object' && current !== null && !Array.isArray(current) && current.kind === 'ref'; hops++) {
    current = objects.get(current.number)?.value;
  }
  return current;
}

/** A stream's decoded bytes: FlateDecode inflated, an unfiltered stream as it is; null for other filters. */
export function decodedStream(object: PdfObject | undefined): Uint8Array | null {
  if (object === undefined || object.stream === null || !isDictionary(object.value)) return null;
  const filter = object.value.entries.get('Filter');
  const filters = filter === undefined ? [] : Array.isArray(filter) ? filter : [filter];
  let data: Uint8Array = object.stream;
  for (const step of filters) {
    if (!isName(step, 'FlateDecode')) return null;
    data = inflateSync(data);
  }
  return data;
}
