import type { DecisionRecordInput, RecordState, RecordSubject } from '../input/decisionRecordInput.js';
import { FONT_BOLD, FONT_REGULAR } from './recordFonts.js';
import { formatTimestamp } from './formatTimestamp.js';
import { INK, TYPE_SIZE, type RecordLayout } from './recordLayout.js';

/** The decision as printed in the summary box. */
export function stateHeadline(state: RecordState): string {
  switch (state) {
    case 'accept':
      return 'ACCEPT';
    case 'reject':
      return 'REJECT';
    case 'accept at truncation':
      return 'ACCEPT AT TRUNCATION';
    case 'reject at truncation':
      return 'REJECT AT TRUNCATION';
    case 'continue':
      return 'NOT DECIDED (CONTINUE)';
  }
}

export const INTERIM_NOTICE =
  'INTERIM RECORD: this run has not reached a decision. It documents the evidence so far and must not be used to release or reject the lot.';

/** "M6 flange nut from Kestrel Fasteners, lot KF-1": what the record is about, in one line. */
export function subjectLine(subject: RecordSubject): string {
  return `${subject.part ?? 'Lot'} from ${subject.source}, ${subject.part === null ? '' : 'lot '}${subject.lotId}`;
}

/** Issuer line, title, interim notice and the decision at a glance. */
export function drawTitleBlock(layout: RecordLayout, input: DecisionRecordInput): void {
  const { doc } = layout;
  const { header } = input;
  const top = layout.y;
  layout.tagged('P', () => {
    doc.font(FONT_BOLD).fontSize(TYPE_SIZE.body).fillColor(INK.text);
    doc.text(header.organisationName, layout.left, top, { width: layout.width / 2 });
    doc.font(FONT_REGULAR).fillColor(INK.muted).text(header.site, layout.left, doc.y, { width: layout.width / 2 });
  });
  const leftBottom = layout.y;
  layout.tagged('P', () => {
    doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.body).fillColor(INK.text);
    doc.text(`Record ${header.recordId}`, layout.left + layout.width / 2, top, { width: layout.width / 2, align: 'right' });
    doc.fillColor(INK.muted).text(
      `${header.softwareName} ${header.softwareVersion}, generated ${formatTimestamp(header.generatedAt)}`,
      layout.left + layout.width / 2,
      doc.y,
      { width: layout.width / 2, align: 'right' },
    );
  });
  layout.y = Math.max(leftBottom, layout.y) + 10;

  const titleTop = layout.y;
  layout.tagged('H1', () => {
    doc.font(FONT_BOLD).fontSize(TYPE_SIZE.title).fillColor(INK.text).text('Decision record', layout.left, titleTop, { width: layout.width });
  });
  layout.gap(2);
  layout.paragraph(subjectLine(input.subject), { color: INK.muted });
  layout.gap(6);

  if (input.interim) drawInterimNotice(layout);
  drawDecisionBox(layout, input);
}

function drawInterimNotice(layout: RecordLayout): void {
  const { doc } = layout;
  doc.font(FONT_BOLD).fontSize(TYPE_SIZE.body + 1);
  const padding = 7;
  const textWidth = layout.width - 2 * padding;
  const height = doc.heightOfString(INTERIM_NOTICE, { width: textWidth }) + 2 * padding;
  const top = layout.y;
  doc.rect(layout.left, top, layout.width, height).lineWidth(2).strokeColor(INK.text).dash(6, { space: 3 }).stroke().undash();
  layout.tagged('P', () => {
    doc.fillColor(INK.text).text(INTERIM_NOTICE, layout.left + padding, top + padding, { width: textWidth });
  });
  layout.y = top + height + 8;
}

function drawDecisionBox(layout: RecordLayout, input: DecisionRecordInput): void {
  const { doc } = layout;
  const { decision } = input;
  const padding = 9;
  const innerWidth = layout.width - 2 * padding;
  const headline = stateHeadline(decision.state);
  const facts = input.evidence.facts;
  doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.body);
  const ruleHeight = doc.heightOfString(decision.rule, { width: innerWidth });
  const height = padding + 20 + ruleHeight + 2 + TYPE_SIZE.body + 4 + padding;
  const top = layout.y;
  doc.rect(layout.left, top, layout.width, height).lineWidth(1.2).strokeColor(INK.text).stroke();
  layout.tagged('P', () => {
    doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.small).fillColor(INK.muted).text('Decision', layout.left + padding, top + padding - 2);
    doc.font(FONT_BOLD).fontSize(14).fillColor(INK.text).text(headline, layout.left + padding, top + padding + 6, { width: innerWidth });
  });
  const ruleTop = top + padding + 24;
  layout.tagged('P', () => {
    doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.body).fillColor(INK.text).text(decision.rule, layout.left + padding, ruleTop, { width: innerWidth });
    doc.fillColor(INK.muted).text(facts, layout.left + padding, doc.y + 2, { width: innerWidth });
  });
  layout.y = Math.max(top + height, layout.y + padding) + 6;
}
