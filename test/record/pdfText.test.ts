import { beforeAll, describe, expect, it } from 'vitest';
import { fingerprintFromPdf } from '../../src-main/record/pdf/fingerprintFromPdf.js';
import { readPdfObjects } from '../../src-main/record/pdf/pdfObjects.js';
import { pdfText } from '../../src-main/record/pdf/pdfText.js';
import { renderDecisionRecord } from '../../src-main/record/pdf/renderDecisionRecord.js';
import { decidedDemoRun, DEMO_FINGERPRINT } from './demoRun.js';
import { pdfText as pdfjsText } from './pdfInspection.js';

/** A minimal one-page PDF written by hand: a simple font without ToUnicode and an unfiltered content stream. */
function handWrittenPdf(content: string): Buffer {
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /Resources << /Font << /F1 4 0 R >> >> /Contents 5 0 R >>',
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
    `<< /Length ${Buffer.byteLength(content, 'latin1')} >>\nstream\n${content}\nendstream`,
  ];
  return Buffer.from(`%PDF-1.4\n${objects.map((body, index) => `${index + 1} 0 obj\n${body}\nendobj\n`).join('')}trailer\n<< /Root 1 0 R >>\n%%EOF\n`, 'latin1');
}

describe("the app's own PDF text reader", () => {
  let record: Buffer;
  beforeAll(async () => {
    record = await renderDecisionRecord(decidedDemoRun());
  }, 60_000);

  it('reads the same text from a decision record as pdfjs-dist does, whitespace aside', async () => {
    const withoutWhitespace = (pages: string[]) => pages.map((page) => page.replace(/\s+/g, ''));
    const ours = pdfText(record);
    expect(ours.length).toBeGreaterThan(1);
    expect(withoutWhitespace(ours)).toEqual(withoutWhitespace(await pdfjsText(record)));
  });

  it('finds the printed fingerprint of a record on its own line after the label', async () => {
    expect((await fingerprintFromPdf(record)).printed).toBe(DEMO_FINGERPRINT);
  });

  it('decodes literal-string escapes and nested parentheses, one line per text object', () => {
    const pdf = handWrittenPdf('BT /F1 12 Tf 72 720 Td (Lot \\(A\\) 7 \\101\\102 (ok)) Tj ET\nBT /F1 12 Tf 72 700 Td [(Accept) -400 (lot)] TJ ET');
    expect(pdfText(pdf)).toEqual(['Lot (A) 7 AB (ok)\nAccept lot\n']);
  });

  it('skips a stream by its length, so "obj" inside its bytes is not read as an object', () => {
    const pdf = handWrittenPdf('BT /F1 12 Tf (9 0 obj) Tj ET');
    expect([...readPdfObjects(pdf).keys()]).toEqual([1, 2, 3, 4, 5]);
    expect(pdfText(pdf)).toEqual(['9 0 obj\n']);
  });

  it('reads no pages and no fingerprint from bytes that are not a PDF', async () => {
    const notPdf = Buffer.from('Decision record\nFingerprint (SHA-256 of the run journal): nothing here\n');
    expect(pdfText(notPdf)).toEqual([]);
    expect(await fingerprintFromPdf(notPdf)).toEqual({ printed: null, metadata: [] });
  });
});
