import type { DecisionRecordInput } from '../input/decisionRecordInput.js';
import { FONT_BOLD, FONT_REGULAR } from './recordFonts.js';
import { INK, TYPE_SIZE } from './recordLayout.js';

export function pageLabel(pageNumber: number, pageCount: number): string {
  return `page ${pageNumber} of ${pageCount}`;
}

/**
 * Writes the footer of every buffered page once the page count is known: record id, run, the
 * start of the fingerprint, "page x of y", and INTERIM on every page of an undecided run.
 * Footers are pagination artifacts, outside the tagged structure.
 */
export function drawPageFooters(doc: PDFKit.PDFDocument, input: DecisionRecordInput): void {
  const range = doc.bufferedPageRange();
  for (let index = range.start; index < range.start + range.count; index++) {
    doc.switchToPage(index);
    const { margins } = doc.page;
    const savedBottom = margins.bottom;
    margins.bottom = 0; // writing below the bottom margin must not start a new page
    const y = doc.page.height - 30;
    const left = margins.left;
    const width = doc.page.width - margins.left - margins.right;
    doc.markContent('Artifact', { type: 'Pagination' });
    doc.moveTo(left, y - 5).lineTo(left + width, y - 5).lineWidth(0.4).strokeColor(INK.rule).stroke();
    doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.small).fillColor(INK.muted);
    const prefix = input.interim ? 'INTERIM ' : '';
    const label = pageLabel(index - range.start + 1, range.count);
    // The left text takes all the room the page label leaves, so real run ids fit on one line.
    const labelWidth = doc.font(FONT_BOLD).widthOfString(label);
    doc.font(FONT_REGULAR).text(
      `${prefix}Decision record ${input.header.recordId}, run ${input.header.runId}, fingerprint ${input.fingerprint.slice(0, 12)}...`,
      left,
      y,
      { width: width - labelWidth - 12, lineBreak: false },
    );
    doc.font(FONT_BOLD).fillColor(INK.text).text(label, left + width - labelWidth - 12, y, {
      width: labelWidth + 12,
      align: 'right',
      lineBreak: false,
    });
    doc.endMarkedContent();
    margins.bottom = savedBottom;
  }
}
