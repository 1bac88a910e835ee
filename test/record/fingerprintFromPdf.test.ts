import { beforeAll, describe, expect, it } from 'vitest';
import { renderDecisionRecord } from '../../src-main/record/pdf/renderDecisionRecord.js';
import {
  fingerprintFromPdf,
  fingerprintFromPdfMetadata,
  fingerprintFromText,
  recordFingerprintMismatches,
} from '../../src-main/record/pdf/fingerprintFromPdf.js';
import { decidedDemoRun, DEMO_FINGERPRINT } from './demoRun.js';

const OTHER = 'a'.repeat(64);

describe('fingerprintFromPdf', () => {
  let pdf: Buffer;
  beforeAll(async () => {
    pdf = await renderDecisionRecord(decidedDemoRun());
  }, 60_000);

  it('reads back the printed fingerprint and both metadata copies (Info and XMP)', async () => {
    const found = await fingerprintFromPdf(pdf);
    expect(found.printed).toBe(DEMO_FINGERPRINT);
    expect(found.metadata).toEqual([DEMO_FINGERPRINT, DEMO_FINGERPRINT]);
    expect(recordFingerprintMismatches(found, DEMO_FINGERPRINT)).toEqual([]);
  });

  it('reports both copies as differing when the journal has moved on since printing', async () => {
    expect(recordFingerprintMismatches(await fingerprintFromPdf(pdf), OTHER)).toEqual(['printed', 'metadata']);
  });

  it('reports only the metadata when the metadata was edited but the page was not', async () => {
    const edited = Buffer.from(pdf.toString('latin1').replaceAll(`sha256:${DEMO_FINGERPRINT}`, `sha256:${OTHER}`), 'latin1');
    expect(fingerprintFromPdfMetadata(edited)).toEqual([OTHER, OTHER]);
    const found = await fingerprintFromPdf(edited);
    expect(found.printed).toBe(DEMO_FINGERPRINT);
    expect(recordFingerprintMismatches(found, DEMO_FINGERPRINT)).toEqual(['metadata']);
  });

  it('finds no fingerprint in text without the label or with too few hex digits', () => {
    expect(fingerprintFromText(`fingerprint ${DEMO_FINGERPRINT}`)).toBeNull();
    expect(fingerprintFromText('Fingerprint (SHA-256 of the run journal): 3f6c0e9a1b7d')).toBeNull();
    expect(fingerprintFromText(`Fingerprint (SHA-256 of the run journal):\n${DEMO_FINGERPRINT.slice(0, 32)} ${DEMO_FINGERPRINT.slice(32)}`)).toBe(DEMO_FINGERPRINT);
  });

  it('counts a PDF without metadata copies as a metadata mismatch', () => {
    expect(recordFingerprintMismatches({ printed: DEMO_FINGERPRINT, metadata: [] }, DEMO_FINGERPRINT)).toEqual(['metadata']);
  });
});
