import type { RecordEntry } from '../input/decisionRecordInput.js';
import { FONT_BOLD, FONT_REGULAR } from './recordFonts.js';
import { formatTimestamp } from './formatTimestamp.js';
import { INK, TYPE_SIZE, type RecordLayout } from './recordLayout.js';

const CELL_PADDING = 3;
const FONT_SIZE = TYPE_SIZE.small;
const RESULT_COLUMN = 3;

interface Column {
  title: string;
  width: number;
  text: (entry: RecordEntry) => string;
}

/** "2025-03-14 08:02:11 +01:00" without the offset when the whole table shares one. */
function timeText(entry: RecordEntry, sharedOffset: string | null): string {
  const printed = formatTimestamp(entry.recordedAt);
  return sharedOffset === null ? printed : printed.slice(0, printed.length - sharedOffset.length - 1);
}

function sharedOffsetOf(entries: readonly RecordEntry[]): string | null {
  const offsets = new Set(entries.map((entry) => formatTimestamp(entry.recordedAt).split(' ')[2]));
  return offsets.size === 1 ? [...offsets][0] : null;
}

/** Column widths from the widest content, capped, with the note column taking what is left. */
function planColumns(doc: PDFKit.PDFDocument, entries: readonly RecordEntry[], tableWidth: number): Column[] {
  const sharedOffset = sharedOffsetOf(entries);
  doc.font(FONT_REGULAR).fontSize(FONT_SIZE);
  // Measured in bold, the widest face used in a cell (titles, and nonconforming results).
  const fit = (title: string, texts: string[], cap: number): number => {
    doc.font(FONT_BOLD);
    let widest = doc.widthOfString(title);
    for (const text of texts) widest = Math.max(widest, doc.widthOfString(text));
    return Math.min(cap, Math.ceil(widest) + 2 * CELL_PADDING + 1);
  };
  const specs: Array<[string, (entry: RecordEntry) => string, number]> = [
    ['#', (entry) => String(entry.sequence), 40],
    [sharedOffset === null ? 'Time' : `Time (${sharedOffset})`, (entry) => timeText(entry, sharedOffset), 120],
    ['Item', (entry) => entry.itemId, 80],
    ['Result', (entry) => entry.resultText, 130],
    ['Category', (entry) => entry.category ?? '', 70],
    ['Note', (entry) => entry.note ?? '', Number.POSITIVE_INFINITY],
    ['Actor', (entry) => entry.actor, 110],
  ];
  const columns = specs.map(([title, text, cap]) => ({ title, text, width: cap === Number.POSITIVE_INFINITY ? 0 : fit(title, entries.map(text), cap) }));
  const noteColumn = columns[5];
  noteColumn.width = tableWidth - columns.reduce((sum, column) => sum + column.width, 0);
  return columns;
}

function voidText(entry: RecordEntry): string {
  const voided = entry.voided;
  if (voided === null) return '';
  return `Voided by entry #${voided.voidSequence} at ${formatTimestamp(voided.voidedAt)} by ${voided.actor}. Reason: ${voided.reason}`;
}

/**
 * Every entry of the run, one row each, in journal order. The header repeats on each page; a row
 * never splits. A voided entry stays in the table, struck through, with its void and reason beneath.
 */
export function drawEntriesTable(layout: RecordLayout, entries: readonly RecordEntry[]): void {
  const { doc } = layout;
  const columns = planColumns(doc, entries, layout.width);
  const table = doc.struct('Table');
  layout.structureRoot.add(table);

  const drawHeader = (): void => {
    doc.font(FONT_BOLD).fontSize(FONT_SIZE);
    const height = FONT_SIZE + 2 * CELL_PADDING + 2;
    const top = layout.y;
    doc.rect(layout.left, top, layout.width, height).fillColor(INK.faint).fill();
    let x = layout.left;
    const cells = columns.map((column) => {
      const cellX = x;
      x += column.width;
      return doc.struct('TH', {}, () => {
        doc.fillColor(INK.text).text(column.title, cellX + CELL_PADDING, top + CELL_PADDING + 1, { width: column.width - 2 * CELL_PADDING, lineBreak: false });
      });
    });
    table.add(doc.struct('TR', {}, cells));
    layout.y = top + height;
  };

  layout.ensureSpace(60);
  drawHeader();
  layout.onNewPage = drawHeader;
  entries.forEach((entry, index) => {
    doc.font(FONT_REGULAR).fontSize(FONT_SIZE);
    const texts = columns.map((column) => column.text(entry));
    const cellHeight = Math.max(...texts.map((text, i) => doc.heightOfString(text || ' ', { width: columns[i].width - 2 * CELL_PADDING })));
    const voidNote = voidText(entry);
    const voidWidth = layout.width - columns[0].width - 2 * CELL_PADDING;
    const voidHeight = voidNote ? doc.heightOfString(voidNote, { width: voidWidth }) + 1 : 0;
    const height = cellHeight + voidHeight + 2 * CELL_PADDING;
    layout.ensureSpace(height);
    const top = layout.y;
    if (index % 2 === 1) doc.rect(layout.left, top, layout.width, height).fillColor('#f4f4f4').fill();
    let x = layout.left;
    const cells = columns.map((column, i) => {
      const cellX = x;
      x += column.width;
      return doc.struct('TD', {}, () => {
        // Counted nonconforming results in bold so they stand out when scanning a long table.
        const emphasise = i === RESULT_COLUMN && entry.nonconformities > 0 && entry.voided === null;
        doc.font(emphasise ? FONT_BOLD : FONT_REGULAR).fontSize(FONT_SIZE).fillColor(entry.voided ? INK.muted : INK.text);
        doc.text(texts[i], cellX + CELL_PADDING, top + CELL_PADDING, { width: column.width - 2 * CELL_PADDING, strike: entry.voided !== null && texts[i] !== '' });
        if (i === columns.length - 1 && voidNote) {
          doc.font(FONT_REGULAR).fillColor(INK.text).text(voidNote, layout.left + columns[0].width + CELL_PADDING, top + CELL_PADDING + cellHeight + 1, { width: voidWidth });
        }
      });
    });
    table.add(doc.struct('TR', {}, cells));
    doc.moveTo(layout.left, top + height).lineTo(layout.right, top + height).lineWidth(0.25).strokeColor(INK.faint).stroke();
    layout.y = top + height;
  });
  layout.onNewPage = null;
  table.end();
  doc.x = layout.left;
}
