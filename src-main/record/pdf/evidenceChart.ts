/**
 * The evidence chart of any model's run: its path against the plan's acceptance and rejection
 * limits, drawn as vector paths from the chart the model's record lines made of the run's picture
 * frame (inspection/runPictures.ts, the frame the screens draw).
 */
import type { ChartPoint, RecordChart } from '../../engine/index.js';
import { FONT_REGULAR } from './recordFonts.js';
import { INK, TYPE_SIZE, type RecordLayout } from './recordLayout.js';

/** Where the chart sits on the page and the ranges its axes show. */
interface ChartFrame {
  readonly left: number;
  readonly top: number;
  readonly width: number;
  readonly height: number;
  readonly xMax: number;
  readonly yMin: number;
  readonly yMax: number;
  readonly xStep: number;
  readonly yStep: number;
}

const CHART_HEIGHT = 190;
/** Room left of the plot for the tick labels and the rotated y title. */
const AXIS_ROOM = 50;

/** Tick spacing of 1, 2 or 5 times a power of ten, never below `minimum`. */
function niceStep(range: number, targetTicks: number, minimum = 0): number {
  const raw = Math.max(range / targetTicks, minimum, Number.MIN_VALUE);
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((candidate) => candidate >= raw) ?? 10 * power;
  return Math.max(step, minimum);
}

/** A tick label without float noise: 0.30000000000000004 prints as 0.3. */
const tickText = (value: number) => String(Number(value.toPrecision(6)));

const toX = (frame: ChartFrame, x: number) => frame.left + (x / frame.xMax) * frame.width;
const toY = (frame: ChartFrame, y: number) => frame.top + frame.height - ((y - frame.yMin) / (frame.yMax - frame.yMin)) * frame.height;

const present = (points: ReadonlyArray<ChartPoint | null>): ChartPoint[] => points.filter((point): point is ChartPoint => point !== null);

/**
 * The axes' ranges: x from 0 to the furthest point (the frame's horizon already looks ahead), y over
 * every point with 0 in view, rounded out to whole ticks; whole-number ticks where every value is whole.
 */
function frameOf(layout: RecordLayout, chart: RecordChart): ChartFrame {
  const all = [...chart.path, ...present(chart.accept), ...present(chart.reject)];
  const whole = (values: number[]) => values.every((value) => Number.isInteger(value));
  const xs = all.map(([x]) => x);
  const ys = all.map(([, y]) => y);
  const xSpan = Math.max(1, ...xs);
  const xStep = niceStep(xSpan, 8, whole(xs) ? 1 : 0);
  const yLow = Math.min(0, ...ys);
  const yHigh = Math.max(1, ...ys);
  const yStep = niceStep(yHigh - yLow, 5, whole(ys) ? 1 : 0);
  const yMin = Math.floor(yLow / yStep) * yStep;
  const yMax = Math.ceil(yHigh / yStep) * yStep;
  return {
    left: layout.left + AXIS_ROOM,
    top: layout.y + 16,
    width: layout.width - AXIS_ROOM,
    height: CHART_HEIGHT,
    xMax: xSpan,
    yMin,
    yMax: yMax > yMin ? yMax : yMin + yStep,
    xStep,
    yStep,
  };
}

function drawAxes(doc: PDFKit.PDFDocument, frame: ChartFrame, chart: RecordChart): void {
  doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.small).fillColor(INK.muted);
  for (let x = 0; x <= frame.xMax + frame.xStep * 1e-9; x += frame.xStep) {
    const at = toX(frame, x);
    doc.moveTo(at, frame.top).lineTo(at, frame.top + frame.height).lineWidth(0.3).strokeColor(INK.faint).stroke();
    doc.text(tickText(x), at - 24, frame.top + frame.height + 3, { width: 48, align: 'center', lineBreak: false });
  }
  for (let y = frame.yMin; y <= frame.yMax + frame.yStep * 1e-9; y += frame.yStep) {
    const at = toY(frame, y);
    doc.moveTo(frame.left, at).lineTo(frame.left + frame.width, at).lineWidth(0.3).strokeColor(INK.faint).stroke();
    doc.text(tickText(y), frame.left - 44, at - 3.5, { width: 40, align: 'right', lineBreak: false });
  }
  doc.rect(frame.left, frame.top, frame.width, frame.height).lineWidth(0.6).strokeColor(INK.rule).stroke();
  doc.fillColor(INK.text).text(chart.xTitle, frame.left, frame.top + frame.height + 14, { width: frame.width, align: 'center' });
  doc.save();
  doc.rotate(-90, { origin: [frame.left - AXIS_ROOM, frame.top + frame.height / 2] });
  doc.text(chart.yTitle, frame.left - AXIS_ROOM - frame.height / 2, frame.top + frame.height / 2 - 8, { width: frame.height, align: 'center' });
  doc.restore();
}

/** One legend entry: label, stroke colour, dashed or not, line width. */
type LegendItem = [label: string, color: string, dashed: boolean, width: number];

/** A one-row legend of line samples, right-aligned over the plot (from its left edge when it would not fit). */
function drawLegend(doc: PDFKit.PDFDocument, frame: ChartFrame, items: readonly LegendItem[]): void {
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

/**
 * A limit: 'line' joins its points straight; 'steps' holds each value flat until the next point's
 * x (the last one for as far as the step before it), as a number that applies from n items on. A
 * null breaks the line.
 */
function strokeLimit(doc: PDFKit.PDFDocument, frame: ChartFrame, points: ReadonlyArray<ChartPoint | null>, style: RecordChart['limitStyle']): void {
  let drawing = false;
  points.forEach((point, i) => {
    if (point === null) {
      drawing = false;
      return;
    }
    const [x, y] = point;
    if (drawing) doc.lineTo(toX(frame, x), toY(frame, y));
    else doc.moveTo(toX(frame, x), toY(frame, y));
    drawing = true;
    if (style === 'steps') {
      const next = points[i + 1] ?? null;
      const previous = points[i - 1] ?? null;
      const width = next !== null ? next[0] - x : previous !== null ? x - previous[0] : 1;
      doc.lineTo(toX(frame, x + width), toY(frame, y));
    }
  });
  doc.stroke();
}

/** The run's path: 'line' joins its points straight; 'steps' runs flat at the last value, then steps to the next. */
function strokePath(doc: PDFKit.PDFDocument, frame: ChartFrame, path: readonly ChartPoint[], style: RecordChart['pathStyle']): void {
  path.forEach(([x, y], i) => {
    if (i === 0) doc.moveTo(toX(frame, x), toY(frame, y));
    else {
      if (style === 'steps') doc.lineTo(toX(frame, x), toY(frame, path[i - 1][1]));
      doc.lineTo(toX(frame, x), toY(frame, y));
    }
  });
  doc.stroke();
}

/** Draws the evidence chart of a run of any model. */
export function drawEvidenceChart(layout: RecordLayout, chart: RecordChart): void {
  const { doc } = layout;
  layout.ensureSpace(CHART_HEIGHT + 50);
  const frame = frameOf(layout, chart);
  layout.tagged(
    'Figure',
    () => {
      drawLegend(doc, frame, [
        [chart.evidenceLabel, INK.evidence, false, 1.6],
        [chart.rejectLabel, INK.text, true, 0.9],
        [chart.acceptLabel, INK.text, false, 0.9],
      ]);
      drawAxes(doc, frame, chart);
      doc.save();
      doc.rect(frame.left, frame.top, frame.width, frame.height).clip();
      doc.lineWidth(0.9).strokeColor(INK.text);
      strokeLimit(doc, frame, chart.accept, chart.limitStyle);
      doc.dash(3, { space: 2 });
      strokeLimit(doc, frame, chart.reject, chart.limitStyle);
      doc.undash();
      doc.lineWidth(1.6).strokeColor(INK.evidence);
      strokePath(doc, frame, chart.path, chart.pathStyle);
      doc.restore();
      // The last point, outside the clip so it stays whole on the frame's edge.
      const [lastX, lastY] = chart.path[chart.path.length - 1];
      doc.circle(toX(frame, lastX), toY(frame, lastY), 2.6).fillColor(INK.evidence).fill();
    },
    { alt: chart.alt },
  );
  layout.y = frame.top + frame.height + 30;
}
