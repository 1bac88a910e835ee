/**
 * The evidence chart of a measurement, lifetime or graded run: its path in the model's natural
 * units against the plan's acceptance and rejection lines, drawn as vector paths.
 */
import { FONT_REGULAR } from './recordFonts.js';
import { drawLineLegend, niceStep } from './evidenceChart.js';
import { INK, TYPE_SIZE, type RecordLayout } from './recordLayout.js';
import type { ChartPoint, ModelRecordDetail } from '../input/decisionRecordInput.js';

interface Frame {
  left: number;
  top: number;
  width: number;
  height: number;
  xMax: number;
  yMin: number;
  yMax: number;
}

const toX = (frame: Frame, x: number) => frame.left + (x / frame.xMax) * frame.width;
const toY = (frame: Frame, y: number) => frame.top + frame.height - ((y - frame.yMin) / (frame.yMax - frame.yMin)) * frame.height;

/** A tick label without float noise: 0.30000000000000004 prints as 0.3. */
const tickText = (value: number) => String(Number(value.toPrecision(6)));

function drawAxes(doc: PDFKit.PDFDocument, frame: Frame, chart: ModelRecordDetail['chart']): void {
  doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.small).fillColor(INK.muted);
  const xStep = niceStep(frame.xMax, 8, frame.xMax / 8);
  for (let x = 0; x <= frame.xMax + 1e-9; x += xStep) {
    const at = toX(frame, x);
    doc.moveTo(at, frame.top).lineTo(at, frame.top + frame.height).lineWidth(0.3).strokeColor(INK.faint).stroke();
    doc.text(tickText(x), at - 24, frame.top + frame.height + 3, { width: 48, align: 'center', lineBreak: false });
  }
  const yStep = niceStep(frame.yMax - frame.yMin, 5, (frame.yMax - frame.yMin) / 5);
  for (let y = Math.ceil(frame.yMin / yStep) * yStep; y <= frame.yMax + 1e-9; y += yStep) {
    const at = toY(frame, y);
    doc.moveTo(frame.left, at).lineTo(frame.left + frame.width, at).lineWidth(0.3).strokeColor(INK.faint).stroke();
    doc.text(tickText(y), frame.left - 44, at - 3.5, { width: 40, align: 'right', lineBreak: false });
  }
  doc.rect(frame.left, frame.top, frame.width, frame.height).lineWidth(0.6).strokeColor(INK.rule).stroke();
  doc.fillColor(INK.text).text(chart.xTitle, frame.left, frame.top + frame.height + 14, { width: frame.width, align: 'center' });
  doc.save();
  doc.rotate(-90, { origin: [frame.left - 50, frame.top + frame.height / 2] });
  doc.text(chart.yTitle, frame.left - 50 - frame.height / 2, frame.top + frame.height / 2 - 8, { width: frame.height, align: 'center' });
  doc.restore();
}

function drawLegend(doc: PDFKit.PDFDocument, frame: Frame, evidenceLabel: string): void {
  drawLineLegend(doc, frame, [
    [evidenceLabel, INK.evidence, false, 1.6],
    ['rejection line', INK.text, true, 0.9],
    ['acceptance line', INK.text, false, 0.9],
  ]);
}

function strokeLine(doc: PDFKit.PDFDocument, frame: Frame, points: readonly ChartPoint[]): void {
  points.forEach(([x, y], i) => (i === 0 ? doc.moveTo(toX(frame, x), toY(frame, y)) : doc.lineTo(toX(frame, x), toY(frame, y))));
  doc.stroke();
}

/** The chart's ranges: every path point, and the lines over the x range drawn, with a little room. */
function frameOf(layout: RecordLayout, chart: ModelRecordDetail['chart'], height: number): Frame {
  const all = [...chart.path, ...chart.accept, ...chart.reject];
  const xMax = Math.max(1e-9, ...all.map(([x]) => x));
  let yMin = Math.min(0, ...all.map(([, y]) => y));
  let yMax = Math.max(1, ...all.map(([, y]) => y));
  const room = 0.04 * (yMax - yMin);
  yMin -= yMin < 0 ? room : 0;
  yMax += room;
  return { left: layout.left + 50, top: layout.y + 16, width: layout.width - 50, height, xMax: xMax * 1.02, yMin, yMax };
}

/** Draws the chart of a measurement, lifetime or graded run. */
export function drawModelEvidenceChart(layout: RecordLayout, chart: ModelRecordDetail['chart']): void {
  const { doc } = layout;
  const chartHeight = 190;
  layout.ensureSpace(chartHeight + 50);
  const frame = frameOf(layout, chart, chartHeight);
  layout.tagged(
    'Figure',
    () => {
      drawLegend(doc, frame, chart.evidenceLabel);
      drawAxes(doc, frame, chart);
      doc.save();
      doc.rect(frame.left, frame.top, frame.width, frame.height).clip();
      doc.lineWidth(0.9).strokeColor(INK.text);
      strokeLine(doc, frame, chart.accept);
      doc.dash(3, { space: 2 });
      strokeLine(doc, frame, chart.reject);
      doc.undash();
      const path: ChartPoint[] = [];
      chart.path.forEach((point, i) => {
        // Lifetime: test time runs at the failures so far, then a failure steps up.
        if (chart.pathStyle === 'time-steps' && i > 0) path.push([point[0], chart.path[i - 1][1]]);
        path.push(point);
      });
      doc.lineWidth(1.6).strokeColor(INK.evidence);
      strokeLine(doc, frame, path);
      doc.restore();
      const [lastX, lastY] = chart.path[chart.path.length - 1];
      doc.circle(toX(frame, lastX), toY(frame, lastY), 2.6).fillColor(INK.evidence).fill();
    },
    { alt: chart.alt },
  );
  layout.y = frame.top + frame.height + 30;
}
