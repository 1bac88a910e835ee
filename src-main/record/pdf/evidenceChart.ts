import type { BoundaryStep, DecisionRecordInput, RecordEntry } from '../input/decisionRecordInput.js';
import { countNoun, countOf } from '../../engine/countWords.js';
import { FONT_REGULAR } from './recordFonts.js';
import { INK, TYPE_SIZE, type RecordLayout } from './recordLayout.js';

/** Cumulative nonconformities after each counted (not voided) entry; index 0 is the start (0 items). */
export function evidencePath(entries: readonly RecordEntry[]): Int32Array {
  const counted = entries.filter((entry) => entry.voided === null);
  const path = new Int32Array(counted.length + 1);
  counted.forEach((entry, i) => {
    path[i + 1] = path[i] + entry.nonconformities;
  });
  return path;
}

/** Tick spacing of 1, 2 or 5 times a power of ten, never below `minimum`. */
export function niceStep(range: number, targetTicks: number, minimum = 1): number {
  const raw = Math.max(range / targetTicks, minimum);
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((candidate) => candidate >= raw) ?? 10 * power;
  return Math.max(step, minimum);
}

interface Frame {
  left: number;
  top: number;
  width: number;
  height: number;
  xMax: number;
  yMax: number;
}

function toX(frame: Frame, items: number): number {
  return frame.left + (items / frame.xMax) * frame.width;
}

function toY(frame: Frame, count: number): number {
  return frame.top + frame.height - (count / frame.yMax) * frame.height;
}

/** A boundary drawn as steps: at n items it sits at the number that applies after n items. */
function strokeSteps(doc: PDFKit.PDFDocument, frame: Frame, steps: readonly BoundaryStep[], pick: (step: BoundaryStep) => number | null): void {
  let drawing = false;
  for (const step of steps) {
    const value = pick(step);
    if (value === null || step.itemsInspected > frame.xMax) {
      drawing = false;
      continue;
    }
    const x = toX(frame, step.itemsInspected);
    const y = toY(frame, value);
    if (drawing) doc.lineTo(x, y);
    else doc.moveTo(x, y);
    doc.lineTo(Math.min(toX(frame, step.itemsInspected + 1), frame.left + frame.width), y);
    drawing = true;
  }
  doc.stroke();
}

function drawAxes(doc: PDFKit.PDFDocument, frame: Frame, xTitle: string, yTitle: string): void {
  doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.small).fillColor(INK.muted);
  const xStep = niceStep(frame.xMax, 8);
  for (let n = 0; n <= frame.xMax; n += xStep) {
    const x = toX(frame, n);
    doc.moveTo(x, frame.top).lineTo(x, frame.top + frame.height).lineWidth(0.3).strokeColor(INK.faint).stroke();
    doc.text(String(n), x - 20, frame.top + frame.height + 3, { width: 40, align: 'center', lineBreak: false });
  }
  const yStep = niceStep(frame.yMax, 5);
  for (let d = 0; d <= frame.yMax; d += yStep) {
    const y = toY(frame, d);
    doc.moveTo(frame.left, y).lineTo(frame.left + frame.width, y).lineWidth(0.3).strokeColor(INK.faint).stroke();
    doc.text(String(d), frame.left - 34, y - 3.5, { width: 30, align: 'right', lineBreak: false });
  }
  doc.rect(frame.left, frame.top, frame.width, frame.height).lineWidth(0.6).strokeColor(INK.rule).stroke();
  doc.fillColor(INK.text).text(xTitle, frame.left, frame.top + frame.height + 14, { width: frame.width, align: 'center' });
  doc.save();
  doc.rotate(-90, { origin: [frame.left - 40, frame.top + frame.height / 2] });
  doc.text(yTitle, frame.left - 40 - frame.height / 2, frame.top + frame.height / 2 - 8, { width: frame.height, align: 'center' });
  doc.restore();
}

/** One legend entry: label, stroke colour, dashed or not, line width. */
export type LegendItem = [label: string, color: string, dashed: boolean, width: number];

/** A one-row legend of line samples, right-aligned over the plot (from its left edge when it would not fit). */
export function drawLineLegend(doc: PDFKit.PDFDocument, frame: { left: number; top: number; width: number }, items: readonly LegendItem[]): void {
  doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.small);
  const gap = 12;
  const widths = items.map(([label]) => 22 + doc.widthOfString(label));
  const total = widths.reduce((sum, width) => sum + width, 0) + gap * (items.length - 1);
  let x = Math.max(frame.left, frame.left + frame.width - total);
  const y = frame.top - 11;
  items.forEach(([label, color, dashed, width], i) => {
    if (dashed) doc.dash(3, { space: 2 });
    doc.moveTo(x, y + 3.5).lineTo(x + 18, y + 3.5).lineWidth(width).strokeColor(color).stroke();
    doc.undash();
    doc.fillColor(INK.text).text(label, x + 22, y, { lineBreak: false });
    x += widths[i] + gap;
  });
}

function drawLegend(doc: PDFKit.PDFDocument, frame: Frame, countWord: string): void {
  drawLineLegend(doc, frame, [
    [`cumulative ${countWord}`, INK.evidence, false, 1.6],
    ['rejection number', INK.text, true, 0.9],
    ['acceptance number', INK.text, false, 0.9],
  ]);
}

/**
 * The evidence chart: cumulative nonconforming against items inspected, over the acceptance and
 * rejection steps of the plan, drawn as vector paths. Voided entries do not count.
 */
export function drawEvidenceChart(layout: RecordLayout, input: DecisionRecordInput): void {
  const { doc } = layout;
  const path = evidencePath(input.entries);
  const counted = path.length - 1;
  const stepsMax = input.boundarySteps.reduce((max, step) => Math.max(max, step.itemsInspected), 0);
  // Show a little of the boundaries beyond the last item, rounded up to a whole tick.
  const xSpan = Math.max(1, counted, Math.min(stepsMax, Math.ceil(counted * 1.1)));
  const xMax = Math.ceil(xSpan / niceStep(xSpan, 8)) * niceStep(xSpan, 8);
  let yTop = path[counted] ?? 0;
  for (const step of input.boundarySteps) {
    if (step.itemsInspected <= xMax && step.rejectionNumber !== null) yTop = Math.max(yTop, step.rejectionNumber);
  }
  const yMax = Math.ceil((yTop + 1) / niceStep(yTop + 1, 5)) * niceStep(yTop + 1, 5);
  const countWord = input.plan.model === 'count' ? 'nonconformities' : 'nonconforming';
  const chartHeight = 190;
  const totalHeight = chartHeight + 50;
  layout.ensureSpace(totalHeight);
  const frame: Frame = { left: layout.left + 40, top: layout.y + 16, width: layout.width - 40, height: chartHeight, xMax, yMax };
  const alt =
    `Chart of cumulative ${countWord} against items inspected: ${countOf(counted, 'item')}, ${path[counted]} ${input.plan.model === 'count' ? countNoun(path[counted], 'nonconformity', 'nonconformities') : countWord}, ` +
    `drawn against the plan's acceptance and rejection numbers.`;
  layout.tagged(
    'Figure',
    () => {
      drawLegend(doc, frame, countWord);
      drawAxes(doc, frame, 'Items inspected, n (items)', `Cumulative ${countWord}, d (${input.plan.model === 'count' ? 'count' : 'items'})`);
      doc.save();
      doc.rect(frame.left, frame.top, frame.width, frame.height).clip();
      doc.lineWidth(0.9).strokeColor(INK.text);
      strokeSteps(doc, frame, input.boundarySteps, (step) => step.acceptanceNumber);
      doc.dash(3, { space: 2 });
      strokeSteps(doc, frame, input.boundarySteps, (step) => step.rejectionNumber);
      doc.undash();
      doc.moveTo(toX(frame, 0), toY(frame, 0));
      for (let n = 1; n <= counted; n++) {
        doc.lineTo(toX(frame, n), toY(frame, path[n - 1])).lineTo(toX(frame, n), toY(frame, path[n]));
      }
      doc.lineWidth(1.6).strokeColor(INK.evidence).stroke();
      doc.restore();
      // The last point, outside the clip so it stays whole on the frame's edge.
      doc.circle(toX(frame, counted), toY(frame, path[counted]), 2.6).fillColor(INK.evidence).fill();
    },
    { alt },
  );
  layout.y = frame.top + frame.height + 30;
}
