/**
 * Invented demo data for decision-record tests. The organisation, supplier, part, people and lots
 * below do not exist; the numbers come from a small Wald SPRT walk written here, independent of
 * the engine, so the record can be tested before the engine and journal glue are wired in.
 */
import type { DecisionRecordInput, RecordEntry, RecordState } from '../../src-main/record/input/decisionRecordInput.js';
import { naiveQualityEstimate } from '../../src-main/engine/estimation/naiveQualityEstimate.js';
import { linearCountPlanRows, planOf, type LimitRow } from '../../src-main/engine/index.js';
import { itemHorizon } from '../../src-main/inspection/index.js';

export const DEMO_FINGERPRINT = '3f6c0e9a1b7d24c58e0f9a3b6d1c7e2f5a8b0c3d6e9f1a4b7c0d3e6f9a2b5c8d';

// Demo plan: p0 = 1 %, p1 = 5 %, alpha = 0.05, beta = 0.10 (common textbook-sized numbers, no source).
const P0 = 0.01;
const P1 = 0.05;
const ALPHA = 0.05;
const BETA = 0.1;

/** Wald's passfail boundaries (Wald, 1947, Sequential Analysis, section 5.3), computed here for the fixture. */
function waldBoundaries() {
  const g1 = Math.log(P1 / P0);
  const g2 = Math.log((1 - P0) / (1 - P1));
  const lnA = Math.log((1 - BETA) / ALPHA);
  const lnB = Math.log(BETA / (1 - ALPHA));
  const sum = g1 + g2;
  return { g1, g2, lnA, lnB, h1: -lnB / sum, h2: lnA / sum, slope: g2 / sum };
}

const WALD = waldBoundaries();

/** The pass/fail model's record lines: the demo's rows, results and chart in the words the app uses. */
const LINES = planOf({ model: 'passfail', p0: P0, p1: P1, alpha: ALPHA, beta: BETA }).recordLines();

/** Acceptance and rejection numbers after n = 1..maxItems items. */
export function demoBoundarySteps(maxItems: number): LimitRow[] {
  const steps: LimitRow[] = [];
  for (let n = 1; n <= maxItems; n++) {
    const acceptance = Math.floor(-WALD.h1 + WALD.slope * n);
    steps.push({ n, accept: acceptance >= 0 ? acceptance : null, reject: Math.ceil(WALD.h2 + WALD.slope * n) });
  }
  return steps;
}

export interface DemoRunOptions {
  /** Items to inspect at most (the walk stops earlier at a decision). */
  items: number;
  /** Whether item n (1-based) is nonconforming. */
  nonconformingAt: (n: number) => boolean;
  /** Item numbers recorded wrongly first, then voided and re-entered. */
  voidedAt?: number[];
  truncation?: { maxItems: number; acceptanceNumber: number };
  /** Stop the walk after this many items without a decision (an interim record). */
  stopUndecidedAfter?: number;
}

const START = Date.parse('2025-03-14T07:30:00+01:00');
const ACTORS = ['A. Brennan', 'T. Okafor'];

function localTime(epochMs: number): string {
  // Fixed +01:00 offset for the invented site; printed as recorded.
  return new Date(epochMs + 3_600_000).toISOString().replace(/\.\d{3}Z$/, '+01:00');
}

/** Walks a demo run item by item until the plan decides, and builds a full record input. */
export function makeDemoRun(options: DemoRunOptions): DecisionRecordInput {
  const maxItems = options.truncation?.maxItems ?? options.items;
  const steps = demoBoundarySteps(Math.max(maxItems, options.items));
  const entries: RecordEntry[] = [];
  let sequence = 0;
  let clock = START;
  let d = 0;
  let state: RecordState = 'continue';
  let rule = `no boundary reached yet: ${0} nonconforming after 0 items`;
  let n = 0;
  const nextTime = (): string => localTime((clock += 47_000));
  while (n < options.items) {
    n += 1;
    const itemId = `KF-0314-${String(n).padStart(4, '0')}`;
    const bad = options.nonconformingAt(n);
    const actor = ACTORS[n % 2];
    if (options.voidedAt?.includes(n)) {
      const wrong: RecordEntry = {
        sequence: ++sequence,
        recordedAt: nextTime(),
        itemId,
        nonconformities: bad ? 0 : 1,
        resultText: LINES.resultText(bad ? 'pass' : 'fail'),
        category: bad ? null : 'thread damage',
        note: 'entered against the wrong item',
        actor,
        voided: null,
      };
      entries.push(wrong);
      wrong.voided = { reason: 'result keyed against the wrong tray position, re-gauged', voidSequence: ++sequence, voidedAt: nextTime(), actor };
    }
    d += bad ? 1 : 0;
    entries.push({
      sequence: ++sequence,
      recordedAt: nextTime(),
      itemId,
      nonconformities: bad ? 1 : 0,
      resultText: LINES.resultText(bad ? 'fail' : 'pass'),
      category: bad ? (n % 3 === 0 ? 'flange burr' : 'thread damage') : null,
      note: bad ? `NO-GO gauge entered ${n % 2 ? '2 turns' : '1 turn'}, part "quarantined", tray 4, bin B` : n % 50 === 0 ? 'gauge re-zeroed per work instruction WI-Q-017, no finding' : null,
      actor,
      voided: null,
    });
    const step = steps[n - 1];
    if (d >= step.reject) {
      state = 'reject';
      rule = `${d} nonconforming >= rejection number ${step.reject} at n = ${n}`;
      break;
    }
    if (step.accept !== null && d <= step.accept) {
      state = 'accept';
      rule = `${d} nonconforming <= acceptance number ${step.accept} at n = ${n}`;
      break;
    }
    if (options.truncation && n === options.truncation.maxItems) {
      const c = options.truncation.acceptanceNumber;
      state = d <= c ? 'accept at truncation' : 'reject at truncation';
      rule = `truncation at n = ${n}: ${d} nonconforming ${d <= c ? '<=' : '>'} ${c}`;
      break;
    }
    if (options.stopUndecidedAfter === n) {
      rule = `no boundary reached: ${d} nonconforming after ${n} items, between acceptance and rejection numbers`;
      break;
    }
  }
  const llr = d * WALD.g1 - (n - d) * WALD.g2;
  const decided = state !== 'continue';
  // The path: the start, then the cumulative count after each counted entry.
  const path = [{ n: 0, total: 0, llr: 0 }];
  for (const entry of entries.filter((candidate) => candidate.voided === null)) {
    const last = path[path.length - 1];
    path.push({ n: last.n + 1, total: last.total + entry.nonconformities, llr: 0 });
  }
  const horizon = itemHorizon(n, 1, options.truncation?.maxItems ?? null);
  return {
    header: {
      organisationName: 'Northgate Assembly Ltd (invented)',
      site: 'Plant 2, goods-in inspection',
      recordId: 'DR-2025-0042',
      runId: 'run-20250314-0007',
      softwareName: 'Tallyline',
      softwareVersion: '0.1.0',
      generatedAt: '2025-03-14T11:05:00+01:00',
    },
    subject: {
      source: 'Kestrel Fasteners (invented supplier)',
      part: 'M6 flange nut, zinc flake, KF-M6-FN-08',
      characteristic: 'Internal thread 6H, GO/NO-GO gauge',
      lotId: 'KF-24-03117',
      lotSize: 20_000,
      inspectors: ['A. Brennan', 'T. Okafor'],
      startedAt: localTime(START),
      endedAt: decided ? localTime(clock) : null,
      timeZone: 'Europe/Dublin',
    },
    plan: {
      planId: 'PL-M6-NUT-THREAD',
      planVersion: '3',
      modelLine: LINES.modelLine,
      acceptableQuality: { symbol: 'p0', value: P0, unit: 'fraction nonconforming' },
      rejectableQuality: { symbol: 'p1', value: P1, unit: 'fraction nonconforming' },
      producerRiskNominal: ALPHA,
      consumerRiskNominal: BETA,
      // Invented "exact" values for the fixture; the engine will supply real ones.
      producerRiskExact: 0.0412,
      consumerRiskExact: 0.0968,
      rows: linearCountPlanRows({
        boundaries: WALD,
        truncation: options.truncation
          ? { maxItems: options.truncation.maxItems, rule: `accept if cumulative nonconforming <= ${options.truncation.acceptanceNumber}, otherwise reject` }
          : null,
        asnH0: 75.3,
        asnH1: 52.9,
      }),
    },
    entries,
    chart: LINES.chart(steps.slice(0, horizon), path),
    decision: { state, rule, itemsInspected: n, nonconformingFound: d, finalLogLikelihoodRatio: llr },
    evidence: LINES.evidence({ decision: decided ? (state.startsWith('accept') ? 'accept' : 'reject') : 'continue', rule: decided ? rule : null, standing: rule, llr, n, total: d }),
    qualityEstimate: naiveQualityEstimate({ model: 'passfail', itemsInspected: n, nonconformities: d, confidenceLevel: 0.95 }),
    outcome: !decided ? 'open' : state.startsWith('accept') ? 'accepted' : 'rejected',
    history: [],
    fingerprint: DEMO_FINGERPRINT,
    interim: !decided,
    approval: { inspectedBy: 'A. Brennan', reviewedBy: null },
  };
}

/** The demo scenario: accepted at n = 135 with 2 nonconforming and one voided entry. */
export function decidedDemoRun(): DecisionRecordInput {
  return makeDemoRun({ items: 400, nonconformingAt: (n) => n === 37 || n === 88, voidedAt: [20] });
}

/** 500 items held between the boundaries (about one nonconforming per 40 items), accepted at truncation. */
export function longDemoRun(): DecisionRecordInput {
  const slope = WALD.slope;
  return makeDemoRun({
    items: 500,
    nonconformingAt: (n) => Math.floor(slope * n + 0.19) > Math.floor(slope * (n - 1) + 0.19),
    voidedAt: [120, 333],
    truncation: { maxItems: 500, acceptanceNumber: 12 },
  });
}
