import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderDecisionRecord, writeDecisionRecord } from '../../src-main/record/pdf/renderDecisionRecord.js';
import { DecisionRecordInputError } from '../../src-main/record/input/decisionRecordInput.js';
import { INTERIM_NOTICE } from '../../src-main/record/pdf/titleBlock.js';
import { decidedDemoRun, DEMO_FINGERPRINT, longDemoRun, makeDemoRun } from './demoRun.js';
import { expectReviewAndCautions, flatten, isStruckThrough, pageGeometry, pdfText, renderPageToPng } from './pdfInspection.js';

describe('the decision record of a decided run', () => {
  const input = decidedDemoRun();
  let pdf: Buffer;
  let pages: string[];
  let text: string;

  beforeAll(async () => {
    pdf = await renderDecisionRecord(input);
    pages = await pdfText(pdf);
    text = flatten(pages.join('\n'));
  }, 60_000);

  it('is the demo scenario: accepted at 135 items with 2 nonconforming and one voided entry', () => {
    expect(input.decision).toMatchObject({ state: 'accept', itemsInspected: 135, nonconformingFound: 2 });
    expect(input.entries.filter((entry) => entry.voided).length).toBe(1);
  });

  it('prints the header: organisation, site, record id, software name and version', () => {
    for (const expected of ['Northgate Assembly Ltd (invented)', 'Plant 2, goods-in inspection', 'Record DR-2025-0042', 'Tallyline 0.1.0']) {
      expect(text).toContain(expected);
    }
  });

  it('prints what was tested: source, part, characteristic, lot, lot size, inspectors, start and end with zone', () => {
    for (const expected of [
      'Source Kestrel Fasteners (invented supplier)',
      'Part M6 flange nut, zinc flake, KF-M6-FN-08',
      'Characteristic Internal thread 6H, GO/NO-GO gauge',
      'Lot / batch KF-24-03117',
      'Lot size 20 000 items',
      'Inspectors A. Brennan, T. Okafor',
      'Started 2025-03-14 07:30:00 +01:00',
      'Ended 2025-03-14 09:17:19 +01:00',
      'Time zone Europe/Dublin',
    ]) {
      expect(text).toContain(expected);
    }
  });

  it('prints the plan: id and version, model, hypotheses with units, risks, boundaries, truncation and ASN', () => {
    // Boundary values: Wald (1947) formulas for p0 = 0.01, p1 = 0.05, alpha = 0.05, beta = 0.10, worked by hand.
    for (const expected of [
      'Plan PL-M6-NUT-THREAD, version 3',
      'Model passfail',
      'H0 (acceptable quality): p0 = 1 % nonconforming',
      'H1 (rejectable quality): p1 = 5 % nonconforming',
      "Producer's risk (alpha) 5 % nominal; 4.12 % exact",
      "Consumer's risk (beta) 10 % nominal; 9.68 % exact",
      'h1 = 1.3639, h2 = 1.7510, slope s = 0.024985',
      'ln A = 2.8904',
      'ln B = -2.2513',
      'Truncation none',
      'Average sample number 75.3 items at H0, 52.9 items at H1',
    ]) {
      expect(text).toContain(expected);
    }
  });

  it('labels the evidence chart with axis titles that state units, and a legend of the steps', () => {
    for (const expected of ['Items inspected, n (items)', 'Cumulative nonconforming, d (items)', 'acceptance number', 'rejection number']) {
      expect(text).toContain(expected);
    }
  });

  it('lists every entry with its sequence, time, item, result, category, note and actor', () => {
    expect(text).toContain('# Time (+01:00) Item Result Category Note Actor');
    for (const entry of input.entries) expect(text).toContain(entry.itemId);
    expect(text).toContain('39 2025-03-14 08:00:33 KF-0314-0037 nonconforming thread damage NO-GO gauge entered 2 turns, part "quarantined", tray 4, bin B T. Okafor');
  });

  it('prints the decision, its rule, items inspected, nonconforming found and the final LLR', () => {
    for (const expected of [
      'ACCEPT',
      'Rule applied 2 nonconforming <= acceptance number 2 at n = 135',
      'Items inspected 135',
      'Nonconforming found 2',
      // 2 ln 5 - 133 ln(0.99 / 0.95) = -2.26644, worked by hand.
      'Final LLR -2.2664',
    ]) {
      expect(text).toContain(expected);
    }
  });

  it('prints the quality estimate with its interval and names the method as naive', () => {
    // Clopper-Pearson for 2 of 135 at 95 %: 0.001799 to 0.05249 (checked against jstat in naiveQualityEstimate.test.ts).
    expect(text).toContain('1.48 % nonconforming; 95 % confidence interval 0.18 % to 5.25 %');
    expect(text).toContain('Naive fraction d/n with exact Clopper-Pearson 95 % interval; ignores the stopping rule');
  });

  it('prints the fingerprint in full and how to verify it', () => {
    expect(text).toContain(`Fingerprint (SHA-256 of the run journal): ${DEMO_FINGERPRINT}`);
    expect(text).toContain('tallyline verify --run run-20250314-0007 --pdf FILE');
  });

  it('prints approval lines and the cautions', () => {
    expect(text).toMatch(/Inspected by .*Date/);
    expectReviewAndCautions(text);
  });

  it('numbers every page "page x of y"', () => {
    pages.forEach((page, index) => expect(flatten(page)).toContain(`page ${index + 1} of ${pages.length}`));
  });

  it('strikes through the voided entry, not its re-entry, and prints the void reason', async () => {
    const voided = input.entries.find((entry) => entry.voided)!;
    expect(text).toContain(`Voided by entry #${voided.voided!.voidSequence} at 2025-03-14 07:46:27 +01:00 by A. Brennan.`);
    expect(text).toContain('Reason: result keyed against the wrong tray position, re-gauged');
    // The voided row and its re-entry carry the same item id; they may fall on different pages.
    const rows: Array<{ y: number; page: number; struck: boolean }> = [];
    for (let page = 1; page <= pages.length; page++) {
      if (!pages[page - 1].includes(voided.itemId)) continue;
      const { texts, segments } = await pageGeometry(pdf, page);
      for (const item of texts.filter((candidate) => candidate.str === voided.itemId)) {
        rows.push({ y: item.y, page, struck: isStruckThrough(item, segments) });
      }
    }
    rows.sort((a, b) => a.page - b.page || b.y - a.y);
    expect(rows.map((row) => row.struck)).toEqual([true, false]);
  });

  it('embeds its fonts and declares PDF/A-1b, tagging and an sRGB output intent', () => {
    const raw = pdf.toString('latin1');
    expect(raw.startsWith('%PDF-1.4')).toBe(true);
    expect(raw).toContain('/FontFile2');
    expect(raw).not.toMatch(/\/BaseFont \/(Helvetica|Times|Courier)/);
    expect(raw).toContain('<pdfaid:part>1</pdfaid:part>');
    expect(raw).toContain('<pdfaid:conformance>B</pdfaid:conformance>');
    expect(raw).toContain('/OutputIntents');
    expect(raw).toContain('/StructTreeRoot');
  });

  it('renders the same bytes from the same input', async () => {
    expect((await renderDecisionRecord(input)).equals(pdf)).toBe(true);
  });

  it('renders page 1 to a PNG kept in test/artifacts/record', () => {
    const png = readFileSync(renderPageToPng(pdf, 'decided-demo-record', 1));
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
    // IHDR width: A4 at 110 dpi is 595.28 / 72 * 110 = 909.4, so 909 or 910 pixels.
    expect(Math.abs(png.readUInt32BE(16) - 909.5)).toBeLessThanOrEqual(1);
    for (let page = 2; page <= pages.length; page++) renderPageToPng(pdf, 'decided-demo-record', page);
  });
});

describe('the decision record of a 500-item run', () => {
  let pages: string[];
  const input = longDemoRun();

  beforeAll(async () => {
    const pdf = await renderDecisionRecord(input);
    pages = await pdfText(pdf);
    renderPageToPng(pdf, 'long-demo-record', 1);
    renderPageToPng(pdf, 'long-demo-record', pages.length);
  }, 60_000);

  it('is 500 items accepted at truncation', () => {
    expect(input.decision).toMatchObject({ state: 'accept at truncation', itemsInspected: 500 });
  });

  it('paginates with a correct "page x of y" on every page, once per page', () => {
    expect(pages.length).toBeGreaterThan(8);
    pages.forEach((page, index) => {
      const labels = flatten(page).match(/page \d+ of \d+/g);
      expect(labels).toEqual([`page ${index + 1} of ${pages.length}`]);
    });
  });

  it('repeats the table header on every page the table continues to, and lists each entry once', () => {
    const firstTablePage = pages.findIndex((page) => flatten(page).includes('# Time (+01:00) Item Result'));
    expect(firstTablePage).toBeGreaterThanOrEqual(0);
    for (const page of pages.slice(firstTablePage)) expect(flatten(page)).toContain('# Time (+01:00) Item Result Category Note Actor');
    const all = flatten(pages.join('\n'));
    // A voided entry and its re-entry share an item id, so count rows per item id.
    const rowsPerItem = new Map<string, number>();
    for (const entry of input.entries) rowsPerItem.set(entry.itemId, (rowsPerItem.get(entry.itemId) ?? 0) + 1);
    for (const [itemId, rows] of rowsPerItem) expect(all.split(` ${itemId} `).length - 1).toBe(rows);
  });
});

describe('the decision record of an undecided run', () => {
  it('is marked interim on every page and says the run is not decided', async () => {
    const input = makeDemoRun({ items: 400, nonconformingAt: (n) => n === 5, stopUndecidedAfter: 30 });
    expect(input.interim).toBe(true);
    const pages = await pdfText(await renderDecisionRecord(input));
    expect(flatten(pages[0])).toContain(INTERIM_NOTICE);
    expect(flatten(pages[0])).toContain('NOT DECIDED (CONTINUE)');
    expect(flatten(pages[0])).toContain('Ended not ended (run undecided)');
    for (const page of pages) expect(flatten(page)).toMatch(/INTERIM Decision record DR-2025-0042/);
  });
});

describe('writeDecisionRecord', () => {
  let directory: string;
  beforeAll(() => {
    directory = mkdtempSync(join(tmpdir(), 'tallyline-record-'));
  });
  afterAll(() => rmSync(directory, { recursive: true, force: true }));

  it('writes the same PDF to a path as renderDecisionRecord returns', async () => {
    const input = decidedDemoRun();
    const path = join(directory, 'record.pdf');
    await writeDecisionRecord(input, path);
    expect(readFileSync(path).equals(await renderDecisionRecord(input))).toBe(true);
  });

  it('refuses an input with a malformed fingerprint before writing any byte', async () => {
    const input = { ...decidedDemoRun(), fingerprint: 'ABC123' };
    const path = join(directory, 'refused.pdf');
    await expect(writeDecisionRecord(input, path)).rejects.toThrow(DecisionRecordInputError);
    await expect(writeDecisionRecord(input, path)).rejects.toThrow(/fingerprint is "ABC123"; allowed: 64 lower-case hex digits/);
    expect(existsSync(path)).toBe(false);
  });

  it('refuses an entry whose time has no offset, naming the entry and the field', async () => {
    const input = decidedDemoRun();
    input.entries[3] = { ...input.entries[3], recordedAt: '2025-03-14T08:02:11' };
    await expect(renderDecisionRecord(input)).rejects.toThrow(/entries\[3\]\.recordedAt is "2025-03-14T08:02:11"; allowed: an ISO 8601 date-time with offset/);
  });

  it('refuses a record of inspected items without a quality estimate', async () => {
    const input = { ...decidedDemoRun(), qualityEstimate: null };
    await expect(renderDecisionRecord(input)).rejects.toThrow(/qualityEstimate is null; allowed: an estimate once items are inspected \(135 are\)/);
  });

  it('refuses an interim flag that contradicts the decision', async () => {
    const input = { ...decidedDemoRun(), interim: true };
    await expect(renderDecisionRecord(input)).rejects.toThrow(/interim is true; allowed: false for a run in state 'accept'/);
  });
});
