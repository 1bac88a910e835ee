/** Test helpers that read a rendered record back with pdfjs-dist (legacy build, for Node). */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

export const ARTIFACT_DIRECTORY = fileURLToPath(new URL('../artifacts/record/', import.meta.url));

/** Whitespace folded to single spaces, so wrapped lines read as one sentence. */
export function flatten(text: string): string {
  return text.replace(/\s+/g, ' ');
}

export interface PositionedText {
  str: string;
  x: number;
  /** Baseline, in PDF user space (origin bottom left). */
  y: number;
  width: number;
  fontSize: number;
}

export interface HorizontalSegment {
  x1: number;
  x2: number;
  /** In PDF user space (origin bottom left). */
  y: number;
}

/**
 * All text of a PDF, page after page, one line per text line, read by pdfjs-dist: a reader
 * independent of the app's own (src-main/record/pdfText.ts), so tests of the record do not check
 * the writer with a reader from the same hands.
 */
export async function pdfText(pdf: Uint8Array): Promise<string[]> {
  const { document } = await openPdf(pdf);
  try {
    const pages: string[] = [];
    for (let number = 1; number <= document.numPages; number++) {
      const page = await document.getPage(number);
      const content = await page.getTextContent();
      let text = '';
      for (const item of content.items) {
        if ('str' in item) text += item.str + (item.hasEOL ? '\n' : '');
      }
      pages.push(text);
    }
    return pages;
  } finally {
    await document.destroy();
  }
}

async function openPdf(pdf: Uint8Array) {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  return { pdfjs, document: await pdfjs.getDocument({ data: new Uint8Array(pdf), isEvalSupported: false, verbosity: 0 }).promise };
}

/**
 * Text items and straight horizontal path segments of one page. pdfkit draws in a flipped
 * coordinate system (`1 0 0 -1 0 height cm`), so path y values are turned back into PDF space.
 */
export async function pageGeometry(pdf: Uint8Array, pageNumber: number): Promise<{ texts: PositionedText[]; segments: HorizontalSegment[] }> {
  const { pdfjs, document } = await openPdf(pdf);
  try {
    const page = await document.getPage(pageNumber);
    const height = page.view[3];
    const content = await page.getTextContent();
    const texts: PositionedText[] = [];
    for (const item of content.items) {
      if ('str' in item && item.str.trim() !== '') {
        texts.push({ str: item.str, x: item.transform[4], y: item.transform[5], width: item.width, fontSize: Math.hypot(item.transform[2], item.transform[3]) });
      }
    }
    const operators = await page.getOperatorList();
    const segments: HorizontalSegment[] = [];
    operators.fnArray.forEach((fn, index) => {
      if (fn !== pdfjs.OPS.constructPath) return;
      const [ops, coordinates] = operators.argsArray[index] as [number[], number[]];
      if (ops.length === 2 && ops[0] === pdfjs.OPS.moveTo && ops[1] === pdfjs.OPS.lineTo && coordinates[1] === coordinates[3]) {
        segments.push({ x1: Math.min(coordinates[0], coordinates[2]), x2: Math.max(coordinates[0], coordinates[2]), y: height - coordinates[1] });
      }
    });
    return { texts, segments };
  } finally {
    await document.destroy();
  }
}

/** Whether a horizontal line crosses the text's glyphs (above the baseline, below the cap height). */
export function isStruckThrough(text: PositionedText, segments: readonly HorizontalSegment[]): boolean {
  return segments.some(
    (segment) => segment.y > text.y && segment.y < text.y + 0.8 * text.fontSize && segment.x1 <= text.x + 0.5 && segment.x2 >= text.x + text.width - 0.5,
  );
}

/** Saves the PDF and renders one page with pdftoppm into test/artifacts/record; returns the PNG path. */
export function renderPageToPng(pdf: Uint8Array, name: string, pageNumber: number, resolution = 110): string {
  mkdirSync(ARTIFACT_DIRECTORY, { recursive: true });
  const pdfPath = join(ARTIFACT_DIRECTORY, `${name}.pdf`);
  writeFileSync(pdfPath, pdf);
  const prefix = join(ARTIFACT_DIRECTORY, `${name}-page-${pageNumber}`);
  execFileSync('pdftoppm', ['-png', '-r', String(resolution), '-f', String(pageNumber), '-l', String(pageNumber), '-singlefile', pdfPath, prefix]);
  return `${prefix}.png`;
}

/** The review line and the cautions every decision record prints, whatever its run. */
export function expectReviewAndCautions(text: string): void {
  expect(text).toMatch(/Reviewed by .*Date/);
  expect(text).toContain('The decision rests on the stated risks');
  expect(text).toContain('An accepted lot is not guaranteed to be free of nonconforming items.');
  expect(text).toContain("Safety-critical characteristics follow the contract, the applicable standards and the organisation's quality system");
}
