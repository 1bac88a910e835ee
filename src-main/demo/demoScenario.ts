/**
 * The invented demo scenario: its sources, parts, characteristics, plans and lots. Every name is
 * made up for the demo and says so; none stands for a real firm, product or person.
 */
import type { LinearCountSpec } from '../engine/index.js';
import type { SourceKind, SourcePart } from '../store/index.js';

export const DEMO_ORGANISATION = 'Demo organisation (invented)';
export const DEMO_SITE = 'Demo site (invented)';
export const DEMO_INSPECTORS = ['Inspector A (invented)', 'Inspector B (invented)'] as const;

export interface DemoSource {
  readonly key: string;
  readonly name: string;
  readonly kind: SourceKind;
  readonly parts: readonly SourcePart[];
}

export interface DemoPlan {
  readonly key: string;
  readonly sourceKey: string;
  readonly name: string;
  readonly part: string;
  readonly characteristic: string;
  readonly spec: LinearCountSpec;
}

/** One lot to inspect: when (days after the scenario starts), the true quality that draws its results. */
export interface DemoLot {
  readonly planKey: string;
  readonly lot: string;
  readonly lotSize: number;
  readonly day: number;
  /** The quality the results are drawn from, in the plan model's quality parameter (labels.quality): fraction nonconforming p for passfail, nonconformities per item lambda for count. */
  readonly trueQuality: number;
  /** Stop after this many results, undecided; absent to run to the plan's decision. */
  readonly stopAfter?: number;
}

export const demoSources: readonly DemoSource[] = [
  {
    key: 'kestrel',
    name: 'Kestrel Fasteners (invented)',
    kind: 'supplier',
    parts: [
      { name: 'M6 flange nut', characteristics: ['thread gauge', 'flange flatness'] },
      { name: 'M8 hex bolt', characteristics: ['head height'] },
    ],
  },
  {
    key: 'brightwater',
    name: 'Brightwater Plastics (invented)',
    kind: 'supplier',
    parts: [{ name: 'housing clip', characteristics: ['flash', 'snap-fit force'] }],
  },
  {
    key: 'line3',
    name: 'Line 3 press (invented)',
    kind: 'line',
    parts: [{ name: 'bracket B-40', characteristics: ['surface dents'] }],
  },
];

export const demoPlans: readonly DemoPlan[] = [
  {
    key: 'nut-thread',
    sourceKey: 'kestrel',
    name: 'M6 flange nut, thread gauge (demo)',
    part: 'M6 flange nut',
    characteristic: 'thread gauge',
    spec: { model: 'passfail', p0: 0.01, p1: 0.08, alpha: 0.05, beta: 0.1, truncation: 120 },
  },
  {
    key: 'clip-flash',
    sourceKey: 'brightwater',
    name: 'Housing clip, flash (demo)',
    part: 'housing clip',
    characteristic: 'flash',
    spec: { model: 'passfail', p0: 0.02, p1: 0.12, alpha: 0.05, beta: 0.1, truncation: 90 },
  },
  {
    key: 'bracket-dents',
    sourceKey: 'line3',
    name: 'Bracket B-40, surface dents (demo)',
    part: 'bracket B-40',
    characteristic: 'surface dents',
    spec: { model: 'count', lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.1, truncation: 60 },
  },
];

/** Over five weeks: mostly good lots, a bad patch at Brightwater in week 3, one lot still being inspected. */
export const demoLots: readonly DemoLot[] = [
  { planKey: 'nut-thread', lot: 'KF-2301', lotSize: 2000, day: 1, trueQuality: 0.004 },
  { planKey: 'clip-flash', lot: 'BW-0417', lotSize: 800, day: 2, trueQuality: 0.01 },
  { planKey: 'bracket-dents', lot: 'L3-W1-A', lotSize: 300, day: 3, trueQuality: 0.05 },
  { planKey: 'nut-thread', lot: 'KF-2302', lotSize: 2000, day: 8, trueQuality: 0.005 },
  { planKey: 'clip-flash', lot: 'BW-0418', lotSize: 800, day: 9, trueQuality: 0.02 },
  { planKey: 'bracket-dents', lot: 'L3-W2-A', lotSize: 300, day: 10, trueQuality: 0.8 },
  { planKey: 'clip-flash', lot: 'BW-0419', lotSize: 800, day: 15, trueQuality: 0.2 },
  { planKey: 'nut-thread', lot: 'KF-2303', lotSize: 2500, day: 16, trueQuality: 0.004 },
  { planKey: 'clip-flash', lot: 'BW-0420', lotSize: 800, day: 18, trueQuality: 0.25 },
  { planKey: 'bracket-dents', lot: 'L3-W4-A', lotSize: 300, day: 23, trueQuality: 0.06 },
  { planKey: 'clip-flash', lot: 'BW-0421', lotSize: 800, day: 29, trueQuality: 0.015 },
  { planKey: 'nut-thread', lot: 'KF-2304', lotSize: 2000, day: 30, trueQuality: 0.006 },
  { planKey: 'clip-flash', lot: 'BW-0422', lotSize: 800, day: 34, trueQuality: 0.02, stopAfter: 9 },
];
