import { createWriteStream } from 'node:fs';
import type { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { validateDecisionRecordInput, type DecisionRecordInput } from '../input/decisionRecordInput.js';
import { findRecordFonts, FONT_BOLD, FONT_MONO, FONT_REGULAR, type RecordFontFiles } from './recordFonts.js';
import { FOOTER_RESERVE, RecordLayout } from './recordLayout.js';
import { drawTitleBlock, subjectLine } from './titleBlock.js';
import { drawDecisionSection, drawPlanSection, drawTestedSection } from './detailSections.js';
import { drawEvidenceChart } from './evidenceChart.js';
import { drawApprovalSection, drawCautionsSection, drawIntegritySection } from './closingSections.js';
import { drawEntriesTable } from './entriesTable.js';
import { drawPageFooters } from './pageFooters.js';
import { fingerprintKeyword } from './fingerprintFromPdf.js';

export interface RenderOptions {
  /** Where the three record fonts are; found under assets/fonts when not given. */
  fonts?: RecordFontFiles;
}

/** XMP is written by pdfkit without escaping: keep metadata text free of XML markup characters. */
function metadataText(text: string): string {
  return text.replaceAll('&', 'and').replace(/[<>]/g, '');
}

/** pdfkit, loaded on the first record: most processes (the CLI's other commands, a host that never prints) never need it. */
async function loadPdfKit(): Promise<typeof import('pdfkit')> {
  return (await import('pdfkit')).default;
}

async function createRecordDocument(input: DecisionRecordInput, fonts: RecordFontFiles): Promise<PDFKit.PDFDocument> {
  const { header, subject } = input;
  const PDFDocument = await loadPdfKit();
  const doc = new PDFDocument({
    size: header.pageSize ?? 'A4',
    margins: { top: 44, left: 48, right: 48, bottom: 20 + FOOTER_RESERVE },
    bufferPages: true,
    pdfVersion: '1.4',
    subset: 'PDF/A-1b',
    tagged: true,
    lang: 'en',
    displayTitle: true,
    // No default font: pdfkit would otherwise load Helvetica (never embedded, so not PDF/A), and a
    // default loaded from our own file would defeat pdfkit's cache for the registered name (the TTF
    // was re-parsed on every font switch). The record's fonts are registered just below.
    font: null as unknown as string,
    info: {
      Title: metadataText(`${input.interim ? 'Interim decision record' : 'Decision record'} ${header.recordId}`),
      Author: metadataText(`${header.organisationName}, ${header.site}`),
      Subject: metadataText(`Run ${header.runId}: ${subjectLine(subject)}`),
      Keywords: fingerprintKeyword(input.fingerprint),
      Creator: metadataText(`${header.softwareName} ${header.softwareVersion}`),
      CreationDate: new Date(header.generatedAt),
    },
  });
  doc.registerFont(FONT_REGULAR, fonts.regular);
  doc.registerFont(FONT_BOLD, fonts.bold);
  doc.registerFont(FONT_MONO, fonts.mono);
  doc.font(FONT_REGULAR);
  return doc;
}

/** Draws every part of the record in reading order onto a fresh document, then the footers. */
function drawRecord(doc: PDFKit.PDFDocument, input: DecisionRecordInput): void {
  const root = doc.struct('Document');
  doc.addStructure(root);
  const layout = new RecordLayout(doc, root);
  drawTitleBlock(layout, input);
  drawTestedSection(layout, input);
  drawPlanSection(layout, input);
  layout.heading('Evidence', 250);
  drawEvidenceChart(layout, input.chart);
  drawDecisionSection(layout, input);
  drawIntegritySection(layout, input);
  drawApprovalSection(layout, input);
  drawCautionsSection(layout);
  layout.heading(`Entries (${input.entries.length}, in journal order)`, 80);
  drawEntriesTable(layout, input.entries);
  root.end();
  drawPageFooters(doc, input);
}

/**
 * Writes the decision record of a run as a PDF to a stream or a file path, and resolves once every
 * byte is written. The input is checked first, so a bad input leaves no half-written file.
 */
export async function writeDecisionRecord(input: DecisionRecordInput, destination: Writable | string, options: RenderOptions = {}): Promise<void> {
  validateDecisionRecordInput(input);
  const doc = await createRecordDocument(input, options.fonts ?? findRecordFonts());
  drawRecord(doc, input);
  const output = typeof destination === 'string' ? createWriteStream(destination) : destination;
  const done = pipeline(doc, output);
  doc.end();
  await done;
}

/** The decision record of a run as PDF bytes. */
export async function renderDecisionRecord(input: DecisionRecordInput, options: RenderOptions = {}): Promise<Buffer> {
  validateDecisionRecordInput(input);
  const doc = await createRecordDocument(input, options.fonts ?? findRecordFonts());
  drawRecord(doc, input);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<void>((resolve, reject) => {
    doc.on('end', resolve);
    doc.on('error', reject);
  });
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}
