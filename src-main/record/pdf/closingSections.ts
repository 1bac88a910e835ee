import type { DecisionRecordInput } from '../input/decisionRecordInput.js';
import { FONT_MONO, FONT_REGULAR } from './recordFonts.js';
import { INK, TYPE_SIZE, type RecordLayout } from './recordLayout.js';

/** Label printed before the fingerprint; fingerprintFromPdf looks for it. */
export const FINGERPRINT_LABEL = 'Fingerprint (SHA-256 of the run journal):';

export const CAUTIONS = [
  "The decision rests on the stated risks: with the plan's producer's risk (alpha) an acceptable lot can be rejected, and with its consumer's risk (beta) a rejectable lot can be accepted.",
  'An accepted lot is not guaranteed to be free of nonconforming items.',
  "Safety-critical characteristics follow the contract, the applicable standards and the organisation's quality system; this record does not replace them.",
];

export function verifyCommand(runId: string): string {
  return `tallyline verify --run ${runId} --pdf FILE`;
}

/** The journal fingerprint in full, and how to check it against the journal. */
export function drawIntegritySection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { doc } = layout;
  layout.heading('Integrity', 50);
  layout.paragraph(FINGERPRINT_LABEL);
  doc.font(FONT_MONO).fontSize(TYPE_SIZE.body + 0.5);
  layout.ensureSpace(14);
  const top = layout.y;
  layout.tagged('P', () => {
    doc.fillColor(INK.text).text(input.fingerprint, layout.left, top, { width: layout.width, lineBreak: false });
  });
  layout.y = top + 14;
  layout.paragraph(
    `How to verify: run "${verifyCommand(input.header.runId)}" with this PDF as FILE; it recomputes the journal's fingerprint and compares it with the one printed here.`,
    { color: INK.muted, size: TYPE_SIZE.small + 0.5 },
  );
}

/** Signature lines for inspection and review, each with a date. */
export function drawApprovalSection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { doc } = layout;
  const lines: Array<[string, string | null]> = [
    ['Inspected by', input.approval.inspectedBy],
    ['Reviewed by', input.approval.reviewedBy],
  ];
  layout.heading('Approval', 80);
  for (const [role, name] of lines) {
    layout.ensureSpace(34);
    const top = layout.y + 16;
    const nameWidth = layout.width * 0.62;
    const dateLeft = layout.left + nameWidth + 24;
    doc.moveTo(layout.left + 70, top + 10).lineTo(layout.left + nameWidth, top + 10).lineWidth(0.6).strokeColor(INK.text).stroke();
    doc.moveTo(dateLeft + 30, top + 10).lineTo(layout.right, top + 10).stroke();
    layout.tagged('P', () => {
      doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.body).fillColor(INK.muted);
      doc.text(role, layout.left, top, { lineBreak: false });
      doc.text('Date', dateLeft, top, { lineBreak: false });
      if (name) doc.fillColor(INK.text).text(name, layout.left + 74, top - 1, { width: nameWidth - 78, lineBreak: false });
    });
    layout.y = top + 18;
  }
}

/** What the decision does and does not mean. */
export function drawCautionsSection(layout: RecordLayout): void {
  layout.heading('Cautions', 40);
  for (const caution of CAUTIONS) layout.paragraph(`- ${caution}`);
}
