import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designLinearCountPlan } from '../../src-main/engine/index.js';
import { estimateAfterStop } from '../../src-main/engine/estimation/index.js';
import { layout, verifyJournal } from '../../src-main/store/index.js';
import { decisionRecordForRun, recordIdFor } from '../../src-main/record/input/decisionRecordFromRun.js';
import { fingerprintFromPdf } from '../../src-main/record/pdf/fingerprintFromPdf.js';
import { formatNumber, formatPercent, formatQuality, formatQualityInterval } from '../../src-main/engine/numberText.js';
import { renderDecisionRecord } from '../../src-main/record/pdf/renderDecisionRecord.js';
import type { DecisionRecordInput } from '../../src-main/record/input/decisionRecordInput.js';
import { INTERIM_NOTICE } from '../../src-main/record/pdf/titleBlock.js';
import {
  INVENTED_ORGANISATION,
  INVENTED_SITE,
  decidedKestrelRun,
  incomingSpec,
  passes,
  recordWorkspace,
  slowSpec,
  sourceWithPlan,
  type RecordWorkspace,
} from './fromRunFixtures.js';
import { expectReviewAndCautions, flatten, isStruckThrough, pageGeometry, pdfText, renderPageToPng } from './pdfInspection.js';

describe('the decision record of a decided run made through the run service', () => {
  let space: RecordWorkspace;
  let runId: string;
  let input: DecisionRecordInput;
  let pdf: Buffer;
  let pages: string[];
  let text: string;

  beforeAll(async () => {
    space = await recordWorkspace();
    ({ runId } = await decidedKestrelRun(space));
    input = await decisionRecordForRun(space.data, runId, new Date('2025-03-14T10:00:00.000Z'));
    pdf = await renderDecisionRecord(input);
    pages = await pdfText(pdf);
    text = flatten(pages.join('\n'));
  }, 60_000);
  afterAll(() => space.cleanup());

  it('is the run as the service closed it: accepted at 57 items with 1 nonconforming, one entry voided', async () => {
    const view = await space.service.openRun(runId);
    expect(view.run.decision).toBe('accept');
    expect(input.decision).toMatchObject({ state: 'accept', itemsInspected: 57, nonconformingFound: 1 });
    expect(input.decision.rule).toBe(view.run.rule);
    expect(input.interim).toBe(false);
    expect(input.entries).toHaveLength(58);
    expect(input.entries.filter((entry) => entry.voided !== null)).toHaveLength(1);
  });

  it('prints the header: organisation and site from settings, record id, software name and version from package.json', () => {
    const packageJson = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    for (const expected of [INVENTED_ORGANISATION, INVENTED_SITE, `Record ${recordIdFor(runId, input.fingerprint)}`, `Tallyline ${packageJson.version}`]) {
      expect(text).toContain(expected);
    }
  });

  it('prints what was tested: source, part and characteristic from the plan version, lot and size, inspectors, start and end with their offset', () => {
    // The stepping clock starts at 07:30:00 UTC and moves 20 s per reading; the offset is this machine's.
    const offset = input.subject.startedAt.slice(19);
    for (const expected of [
      'M6 flange nut, zinc flake from Kestrel Fasteners (invented), lot KF-25-0311',
      'Source Kestrel Fasteners (invented)',
      'Part M6 flange nut, zinc flake',
      'Characteristic Internal thread 6H, GO/NO-GO gauge',
      'Lot / batch KF-25-0311',
      'Lot size 20 000 items',
      'Inspectors A. Brennan, T. Okafor',
      `Time zone UTC${offset} (as recorded by the inspecting computer)`,
    ]) {
      expect(text).toContain(expected);
    }
    expect(text).toMatch(/Started 2025-03-14 \d\d:\d\d:\d\d [+-]\d\d:\d\d/);
    expect(text).toMatch(/Ended 2025-03-14 \d\d:\d\d:\d\d [+-]\d\d:\d\d/);
  });

  it("prints the plan with the engine's exact risks and ASN, Wald's boundaries, truncation, and its name, id and version", () => {
    const design = designLinearCountPlan(incomingSpec, { curvePoints: 2 });
    const { boundaries } = design;
    for (const expected of [
      `Plan M6 flange nut, thread gauge, id ${input.plan.planId}, version 1`,
      'Model passfail',
      'H0 (acceptable quality): p0 = 1 % nonconforming',
      'H1 (rejectable quality): p1 = 10 % nonconforming',
      `Producer's risk (alpha) 5 % nominal; ${formatPercent(design.exact.alpha)} exact`,
      `Consumer's risk (beta) 5 % nominal; ${formatPercent(design.exact.beta)} exact`,
      `h1 = ${boundaries.h1.toFixed(4)}, h2 = ${boundaries.h2.toFixed(4)}, slope s = ${boundaries.slope.toFixed(6)}`,
      `ln A = ${boundaries.lnA.toFixed(4)}`,
      `ln B = ${boundaries.lnB.toFixed(4)}`,
      'Truncation none',
      `Average sample number ${formatNumber(design.exact.asnH0)} items at H0, ${formatNumber(design.exact.asnH1)} items at H1`,
    ]) {
      expect(text).toContain(expected);
    }
    // Wald (1947): ln A = ln((1 - beta) / alpha) = ln 19 = 2.9444 for 5 % risks, worked by hand.
    expect(text).toContain('ln A = 2.9444');
  });

  it('draws the evidence chart against steps reaching past the stop', () => {
    expect(text).toContain('Items inspected, n (items)');
    expect(text).toContain('acceptance number');
    const { accept, reject } = input.chart;
    expect(reject[0]?.[0]).toBe(1);
    expect(reject.at(-1)?.[0]).toBeGreaterThan(57);
    // The accepting step: 1 nonconforming is within the acceptance number at n = 57, not at 56.
    expect(accept[56]).toEqual([57, 1]);
    expect(accept[55]).toEqual([56, 0]);
  });

  it('lists every entry with sequence, item, result, category, note and actor, the voided one struck through with its reason', async () => {
    expect(text).toMatch(/# Time( \([+-]\d\d:\d\d\))? Item Result Category Note Actor/);
    expect(text).toContain('KF-0011 nonconforming thread damage NO-GO gauge entered 2 turns, part "quarantined", tray 4 A. Brennan');
    const voided = input.entries.find((entry) => entry.voided !== null)!;
    expect(voided).toMatchObject({ itemId: 'KF-0012', nonconformities: 0, voided: { reason: 'keyed against the wrong tray position, re-gauged', actor: 'T. Okafor' } });
    expect(text).toContain(`Voided by entry #${voided.voided!.voidSequence}`);
    expect(text).toContain('Reason: keyed against the wrong tray position, re-gauged');
    const rows: boolean[] = [];
    for (let page = 1; page <= pages.length; page++) {
      const { texts, segments } = await pageGeometry(pdf, page);
      for (const item of texts.filter((candidate) => candidate.str === 'KF-0012')) rows.push(isStruckThrough(item, segments));
    }
    // The mistaken result is struck through; its re-entry (the same id gauged again) is not.
    expect(rows).toEqual([true, false]);
  });

  it('prints the decision, its rule, the counts and the final LLR', () => {
    for (const expected of ['ACCEPT', `Rule applied ${input.decision.rule}`, 'Items inspected 57', 'Nonconforming found 1']) {
      expect(text).toContain(expected);
    }
    // LLR = d ln(p1/p0) + (n - d) ln((1-p1)/(1-p0)) = ln 10 + 56 ln(0.9/0.99) = 2.30259 - 5.33737 = -3.03479, worked by hand.
    expect(text).toContain('Final LLR -3.0348');
  });

  it("prints Whitehead's bias-adjusted estimate and the stagewise exact interval at the settings' level, with the method named", () => {
    const after = estimateAfterStop(incomingSpec, { n: 57, total: 1, confidence: 0.9 });
    expect(text).toContain(
      `bias-adjusted ${formatQuality(after.biasAdjusted, 'fraction nonconforming')}; 90 % confidence interval ${formatQualityInterval(after.interval.lower, after.interval.upper, 'fraction nonconforming')}`,
    );
    expect(text).toContain(`naive d/n = ${formatQuality(1 / 57, 'fraction nonconforming')}, for comparison only (biased after a sequential stop)`);
    expect(text).toContain('Bias-adjusted estimate (Whitehead 1986) and exact 90 % interval from the stagewise ordering of the sample space');
    expect(after.biasAdjusted).toBeLessThan(1 / 57);
  });

  it("prints the journal's own fingerprint, in the text and in the metadata, and how to verify it", async () => {
    const journal = await verifyJournal(layout.runJournal(space.data, runId));
    expect(journal.ok).toBe(true);
    expect(await fingerprintFromPdf(pdf)).toEqual({ printed: journal.fingerprint, metadata: [journal.fingerprint, journal.fingerprint] });
    expect(text).toContain(`tallyline verify --run ${runId} --pdf FILE`);
  });

  it('prints approval lines with the inspector named, and the cautions', () => {
    // pdfjs reads the row's labels before the name written onto its line.
    expect(text).toMatch(/Inspected by Date ?A\. Brennan/);
    expectReviewAndCautions(text);
  });

  it('numbers every page "page x of y"', () => {
    pages.forEach((page, index) => expect(flatten(page)).toContain(`page ${index + 1} of ${pages.length}`));
  });

  it('renders page 1 to a PNG kept in test/artifacts/record', () => {
    const png = readFileSync(renderPageToPng(pdf, 'from-run-decided', 1));
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
    for (let page = 2; page <= pages.length; page++) renderPageToPng(pdf, 'from-run-decided', page);
  });
});

describe('the record of an undecided 500-entry run made through the run service', () => {
  let space: RecordWorkspace;
  let pages: string[];
  let input: DecisionRecordInput;

  beforeAll(async () => {
    space = await recordWorkspace();
    const { source, plan } = await sourceWithPlan(space, 'Brightwater Plastics (invented)', 'Cap moulding, flash', slowSpec);
    const run = await space.service.startRun({ planId: plan.id, sourceId: source.id, lot: 'BW-7781', inspector: 'R. Quint' });
    let i = 0;
    for (const result of passes('BW', 500, 'R. Quint')) {
      i += 1;
      await space.service.recordResult(run.run.id, i % 125 === 0 ? { ...result, result: 'fail', category: 'flash' } : result);
    }
    input = await decisionRecordForRun(space.data, run.run.id, new Date('2025-03-15T12:00:00.000Z'));
    const pdf = await renderDecisionRecord(input);
    pages = await pdfText(pdf);
    renderPageToPng(pdf, 'from-run-interim-500', 1);
    renderPageToPng(pdf, 'from-run-interim-500', pages.length);
  }, 120_000);
  afterAll(() => space.cleanup());

  it('is interim, with the naive estimate labelled as such and no end time', () => {
    expect(input.interim).toBe(true);
    expect(input.decision).toMatchObject({ state: 'continue', itemsInspected: 500, nonconformingFound: 4 });
    const first = flatten(pages[0]);
    expect(first).toContain(INTERIM_NOTICE);
    expect(first).toContain('Ended not ended (run undecided)');
    expect(flatten(pages.join('\n'))).toContain('Interim, the run is undecided: Naive fraction d/n with exact Clopper-Pearson 90 % interval');
  });

  it('paginates with a correct "page x of y" on every page, once per page, and lists every item', () => {
    expect(pages.length).toBeGreaterThan(8);
    pages.forEach((page, index) => {
      expect(flatten(page).match(/page \d+ of \d+/g)).toEqual([`page ${index + 1} of ${pages.length}`]);
      expect(flatten(page)).toContain('INTERIM Decision record');
    });
    const all = flatten(pages.join('\n'));
    for (const id of ['BW-0001', 'BW-0125', 'BW-0250', 'BW-0499', 'BW-0500']) expect(all.split(` ${id} `).length - 1).toBe(1);
  });
});

describe('a run with no items yet', () => {
  it('gets an interim record that says there is no estimate yet', async () => {
    const space = await recordWorkspace();
    try {
      const { source, plan } = await sourceWithPlan(space, 'Kestrel Fasteners (invented)', 'M6 flange nut, thread gauge', incomingSpec);
      const run = await space.service.startRun({ planId: plan.id, sourceId: source.id, lot: 'KF-25-0400' });
      const input = await decisionRecordForRun(space.data, run.run.id);
      expect(input.qualityEstimate).toBeNull();
      const text = flatten((await pdfText(await renderDecisionRecord(input))).join('\n'));
      expect(text).toContain('Quality estimate none yet: no items inspected');
      expect(text).toContain('Inspector not named');
      // A plan saved without part and characteristic: the record says so rather than inventing them.
      expect(text).toContain('Lot from Kestrel Fasteners (invented), KF-25-0400');
      expect(text).toContain('Part not recorded with the run');
    } finally {
      await space.cleanup();
    }
  });
});
