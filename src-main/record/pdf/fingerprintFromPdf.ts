import { FINGERPRINT_LABEL } from './closingSections.js';
import { pdfText } from './pdfText.js';

const KEYWORD_PREFIX = 'tallyline-fingerprint:sha256:';
const KEYWORD_PATTERN = /tallyline-fingerprint:sha256:([0-9a-f]{64})/g;

/** The metadata keyword that carries a record's fingerprint (PDF Info Keywords, mirrored in XMP). */
export function fingerprintKeyword(fingerprint: string): string {
  return `${KEYWORD_PREFIX}${fingerprint}`;
}

/** What a record PDF says its fingerprint is, read two independent ways. */
export interface RecordPdfFingerprint {
  /** The fingerprint printed on the page, read from the PDF's text; null when none is found. */
  printed: string | null;
  /** Every copy found in the metadata (Info Keywords and XMP), in file order; normally two equal values. */
  metadata: string[];
}

/**
 * Fingerprint copies in a record's metadata, read from the raw bytes: the Info strings and the XMP
 * packet of a record are written uncompressed, so no PDF parser is needed.
 */
export function fingerprintFromPdfMetadata(pdf: Uint8Array): string[] {
  const text = Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength).toString('latin1');
  return [...text.matchAll(KEYWORD_PATTERN)].map((match) => match[1]);
}

/** The 64 hex digits printed after the fingerprint label in a record's text, or null. */
export function fingerprintFromText(text: string): string | null {
  const at = text.indexOf(FINGERPRINT_LABEL);
  if (at < 0) return null;
  const after = text.slice(at + FINGERPRINT_LABEL.length, at + FINGERPRINT_LABEL.length + 200).replace(/\s+/g, '');
  const match = /^[0-9a-f]{64}/.exec(after);
  return match ? match[0] : null;
}

/** Reads the fingerprint a record PDF prints and the copies it carries in its metadata. */
export async function fingerprintFromPdf(pdf: Uint8Array): Promise<RecordPdfFingerprint> {
  // The page text is read by the app's own small PDF reader (no native parts, nothing to install).
  const pages = pdfText(pdf);
  return { printed: fingerprintFromText(pages.join('\n')), metadata: fingerprintFromPdfMetadata(pdf) };
}

/**
 * Which of a record's fingerprints differ from the journal's: `printed`, `metadata`, both, or none.
 * A missing fingerprint counts as differing.
 */
export function recordFingerprintMismatches(found: RecordPdfFingerprint, journalFingerprint: string): Array<'printed' | 'metadata'> {
  const mismatches: Array<'printed' | 'metadata'> = [];
  if (found.printed !== journalFingerprint) mismatches.push('printed');
  if (found.metadata.length === 0 || found.metadata.some((value) => value !== journalFingerprint)) mismatches.push('metadata');
  return mismatches;
}
