import { FONT_BOLD, FONT_REGULAR } from './recordFonts.js';

/** Ink colours: greys for structure, one dark blue for the run's own evidence. */
export const INK = {
  text: '#111111',
  muted: '#555555',
  rule: '#999999',
  faint: '#dddddd',
  evidence: '#1f3f7a',
} as const;

export const TYPE_SIZE = {
  title: 16,
  heading: 11.5,
  body: 9,
  small: 7.5,
} as const;

/** Space kept free at the bottom of every page for the footer. */
export const FOOTER_RESERVE = 40;

/**
 * The writing cursor of a record: page geometry, page breaks, and the tagged structure that every
 * drawn block joins (so the PDF is tagged: headings, paragraphs, the figure and the table).
 */
export class RecordLayout {
  /** Called after a page break, e.g. to repeat a table header. */
  onNewPage: (() => void) | null = null;

  constructor(
    readonly doc: PDFKit.PDFDocument,
    readonly structureRoot: PDFKit.PDFStructureElement,
  ) {}

  get left(): number {
    return this.doc.page.margins.left;
  }

  get right(): number {
    return this.doc.page.width - this.doc.page.margins.right;
  }

  get width(): number {
    return this.right - this.left;
  }

  /** Lowest y a block may reach. */
  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  get y(): number {
    return this.doc.y;
  }

  set y(value: number) {
    this.doc.y = value;
  }

  /** Starts a new page when `height` points do not fit below the cursor; returns whether it did. */
  ensureSpace(height: number): boolean {
    if (this.doc.y + height <= this.bottom) return false;
    this.newPage();
    return true;
  }

  newPage(): void {
    this.doc.addPage();
    this.doc.x = this.left;
    this.doc.y = this.doc.page.margins.top;
    this.onNewPage?.();
  }

  gap(points: number): void {
    this.doc.y += points;
  }

  /** Draws inside a structure element of `type` (P, H1, H2, Figure, ...) attached to the document. */
  tagged(type: string, draw: () => void, options: PDFKit.Mixins.StructureElementOptions = {}): void {
    this.structureRoot.add(this.doc.struct(type, options, draw));
  }

  /** Section heading with a thin rule; keeps `keepWith` points of what follows on the same page. */
  heading(text: string, keepWith = 60): void {
    this.ensureSpace(TYPE_SIZE.heading + 10 + keepWith);
    this.gap(6);
    const top = this.y;
    this.tagged('H2', () => {
      this.doc.font(FONT_BOLD).fontSize(TYPE_SIZE.heading).fillColor(INK.text).text(text, this.left, top, { width: this.width });
    });
    const ruleY = this.y + 1;
    this.doc.moveTo(this.left, ruleY).lineTo(this.right, ruleY).lineWidth(0.5).strokeColor(INK.rule).stroke();
    this.y = ruleY + 5;
  }

  /** A paragraph of body text across the full width. */
  paragraph(text: string, options: { font?: string; size?: number; color?: string } = {}): void {
    const font = options.font ?? FONT_REGULAR;
    const size = options.size ?? TYPE_SIZE.body;
    this.doc.font(font).fontSize(size);
    const height = this.doc.heightOfString(text, { width: this.width });
    this.ensureSpace(height);
    const top = this.y;
    this.tagged('P', () => {
      this.doc.fillColor(options.color ?? INK.text).text(text, this.left, top, { width: this.width });
    });
    this.gap(2);
  }

  /**
   * Label/value pairs in two columns (label muted on the left). Rows never split over a page.
   */
  keyValues(rows: ReadonlyArray<readonly [string, string]>, labelWidth = 150): void {
    const valueWidth = this.width - labelWidth;
    for (const [label, value] of rows) {
      this.doc.font(FONT_REGULAR).fontSize(TYPE_SIZE.body);
      const height = Math.max(
        this.doc.heightOfString(label, { width: labelWidth - 8 }),
        this.doc.heightOfString(value, { width: valueWidth }),
      );
      this.ensureSpace(height + 2);
      const top = this.y;
      this.tagged('P', () => {
        this.doc.fillColor(INK.muted).text(label, this.left, top, { width: labelWidth - 8 });
        this.doc.fillColor(INK.text).text(value, this.left + labelWidth, top, { width: valueWidth });
      });
      this.y = top + height + 2;
    }
  }
}
