/**
 * The text a PDF shows, page after page, read with the small object reader (`pdfObjects.ts`):
 * each page's content streams are walked for their text-showing operators (Tj, TJ, ', "), and the
 * shown codes are mapped to Unicode through each font's ToUnicode CMap. One line per text object
 * (BT … ET), which is how the decision record writes each line of text.
 *
 * References: ISO 32000-1:2008 §9.4 text objects and operators, §9.10.3 ToUnicode CMaps
 * (from memory).
 */
import {
  decodedStream,
  isDictionary,
  isKeyword,
  isName,
  PdfLexer,
  readPdfObjects,
  resolve,
  type PdfDictionary,
  type PdfObject,
  type PdfString,
  type PdfValue,
} from './pdfObjects.js';

/** Code → text of one font, and how many bytes a code takes (1 for simple fonts, 2 for Identity-H). */
interface FontText {
  readonly codeBytes: number;
  readonly map: ReadonlyMap<number, string>;
}

type Objects = ReadonlyMap<number, PdfObject>;

function dictionaryAt(objects: Objects, value: PdfValue | undefined): PdfDictionary | null {
  const resolved = resolve(objects, value);
  return isDictionary(resolved) ? resolved : null;
}

function utf16be(bytes: Uint8Array): string {
  let text = '';
  for (let index = 0; index + 1 < bytes.length; index += 2) text += String.fromCharCode((bytes[index] << 8) | bytes[index + 1]);
  return text;
}

function codeOf(bytes: Uint8Array): number {
  let code = 0;
  for (const byte of bytes) code = code * 256 + byte;
  return code;
}

/** Reads a ToUnicode CMap's bfchar and bfrange sections. */
function parseToUnicode(cmap: Uint8Array): FontText {
  const lexer = new PdfLexer(cmap);
  const map = new Map<number, string>();
  let codeBytes = 1;
  const operands: PdfValue[] = [];
  for (let token = lexer.value(); token !== null; token = lexer.value()) {
    if (!isKeyword(token, 'endbfchar') && !isKeyword(token, 'endbfrange') && !isKeyword(token, 'endcodespacerange')) {
      if (typeof token === 'object' && token !== null && 'keyword' in token) operands.length = 0;
      else operands.push(token);
      continue;
    }
    const strings = operands.splice(0);
    if (isKeyword(token, 'endcodespacerange')) {
      const first = strings[0] as PdfString | undefined;
      if (first?.kind === 'string') codeBytes = Math.max(1, first.bytes.length);
    } else if (isKeyword(token, 'endbfchar')) {
      for (let index = 0; index + 1 < strings.length; index += 2) {
        const source = strings[index] as PdfString;
        const target = strings[index + 1] as PdfString;
        if (source?.kind === 'string' && target?.kind === 'string') map.set(codeOf(source.bytes), utf16be(target.bytes));
      }
    } else {
      for (let index = 0; index + 2 < strings.length; index += 3) {
        const low = strings[index] as PdfString;
        const high = strings[index + 1] as PdfString;
        const target = strings[index + 2];
        if (low?.kind !== 'string' || high?.kind !== 'string') continue;
        const from = codeOf(low.bytes);
        const to = codeOf(high.bytes);
        for (let code = from; code <= to && code - from < 65536; code++) {
          if (Array.isArray(target)) {
            const item = target[code - from] as PdfString | undefined;
            if (item?.kind === 'string') map.set(code, utf16be(item.bytes));
          } else if (typeof target === 'object' && target !== null && !Array.isArray(target) && target.kind === 'string') {
            const base = Uint8Array.from(target.bytes);
            base[base.length - 1] += code - from;
            map.set(code, utf16be(base));
          }
        }
      }
    }
  }
  return { codeBytes, map };
}

function fontText(objects: Objects, font: PdfDictionary | null, cache: Map<PdfDictionary, FontText>): FontText {
  if (font === null) return { codeBytes: 1, map: new Map() };
  let known = cache.get(font);
  if (known === undefined) {
    const toUnicode = font.entries.get('ToUnicode');
    const cmap = toUnicode !== undefined && typeof toUnicode === 'object' && toUnicode !== null && !Array.isArray(toUnicode) && toUnicode.kind === 'ref' ? decodedStream(objects.get(toUnicode.number)) : null;
    const identity = isName(font.entries.get('Encoding'), 'Identity-H');
    known = cmap === null ? { codeBytes: identity ? 2 : 1, map: new Map() } : parseToUnicode(cmap);
    if (identity) known = { codeBytes: 2, map: known.map };
    cache.set(font, known);
  }
  return known;
}

function showString(string: PdfString, font: FontText): string {
  let text = '';
  for (let index = 0; index + font.codeBytes <= string.bytes.length; index += font.codeBytes) {
    const code = codeOf(string.bytes.subarray(index, index + font.codeBytes));
    text += font.map.get(code) ?? (font.codeBytes === 1 ? String.fromCharCode(code) : '');
  }
  return text;
}

function pageContents(objects: Objects, page: PdfDictionary): Uint8Array[] {
  const contents = page.entries.get('Contents');
  const references = Array.isArray(contents) ? contents : contents === undefined ? [] : [contents];
  const streams: Uint8Array[] = [];
  for (const reference of references) {
    if (typeof reference === 'object' && reference !== null && !Array.isArray(reference) && reference.kind === 'ref') {
      const data = decodedStream(objects.get(reference.number));
      if (data !== null) streams.push(data);
    }
  }
  return streams;
}

/** The text of one page's content: one line per text object. */
function textOfPage(objects: Objects, page: PdfDictionary, fontCache: Map<PdfDictionary, FontText>): string {
  const resources = dictionaryAt(objects, page.entries.get('Resources'));
  const fonts = dictionaryAt(objects, resources?.entries.get('Font'));
  let font: FontText = { codeBytes: 1, map: new Map() };
  let text = '';
  for (const content of pageContents(objects, page)) {
    const lexer = new PdfLexer(content);
    const operands: PdfValue[] = [];
    for (let token = lexer.next(); token !== null; token = lexer.next()) {
      if (typeof token !== 'object' || token === null || !('keyword' in token)) {
        operands.push(token);
        continue;
      }
      const operator = token.keyword;
      if (operator === 'Tf' && isName(operands[0])) {
        font = fontText(objects, dictionaryAt(objects, fonts?.entries.get(operands[0].name)), fontCache);
      } else if (operator === 'Tj' || operator === "'" || operator === '"') {
        const shown = operands[operands.length - 1];
        if (operator !== 'Tj') text += '\n';
        if (typeof shown === 'object' && shown !== null && !Array.isArray(shown) && shown.kind === 'string') text += showString(shown, font);
      } else if (operator === 'TJ' && Array.isArray(operands[0])) {
        for (const part of operands[0]) {
          // A wide negative adjustment is a gap between words (in thousandths of the font size).
          if (typeof part === 'number' && part < -250) text += ' ';
          else if (typeof part === 'object' && part !== null && !Array.isArray(part) && part.kind === 'string') text += showString(part, font);
        }
      } else if (operator === 'ET' || operator === 'T*') {
        if (!text.endsWith('\n')) text += '\n';
      }
      operands.length = 0;
    }
  }
  return text;
}

/** The pages of the document in order, from the catalog's page tree. */
function pagesInOrder(objects: Objects): PdfDictionary[] {
  const catalog = [...objects.values()].find((object) => isDictionary(object.value) && isName(object.value.entries.get('Type'), 'Catalog'));
  const pages: PdfDictionary[] = [];
  const visit = (node: PdfDictionary | null, depth: number) => {
    if (node === null || depth > 64) return;
    if (isName(node.entries.get('Type'), 'Page')) {
      pages.push(node);
      return;
    }
    const kids = resolve(objects, node.entries.get('Kids'));
    if (Array.isArray(kids)) for (const kid of kids) visit(dictionaryAt(objects, kid), depth + 1);
  };
  if (catalog !== undefined && isDictionary(catalog.value)) visit(dictionaryAt(objects, catalog.value.entries.get('Pages')), 0);
  return pages;
}

/** All text of a PDF, one string per page, one line per text object. */
export function pdfText(pdf: Uint8Array): string[] {
  const objects = readPdfObjects(pdf);
  const fontCache = new Map<PdfDictionary, FontText>();
  return pagesInOrder(objects).map((page) => textOfPage(objects, page, fontCache));
}
