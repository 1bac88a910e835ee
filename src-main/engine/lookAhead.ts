/**
 * What a run can still expect from where it stands, under H0, H1 and the current estimate: the
 * probability of ending in acceptance and the items (or test time) still to go. Every model's live
 * state carries these.
 */
export interface LookAhead {
  probabilityAcceptH0: number;
  probabilityAcceptH1: number;
  probabilityAcceptEstimate: number | null;
  expectedRemainingH0: number;
  expectedRemainingH1: number;
  expectedRemainingEstimate: number | null;
}

/** The look-ahead from exact evaluations (probability of acceptance, remaining items) at H0, H1 and the estimate. */
export function lookAhead(
  atH0: { accept: number; asn: number },
  atH1: { accept: number; asn: number },
  atEstimate: { accept: number; asn: number } | null,
): LookAhead {
  return {
    probabilityAcceptH0: atH0.accept,
    probabilityAcceptH1: atH1.accept,
    probabilityAcceptEstimate: atEstimate === null ? null : atEstimate.accept,
    expectedRemainingH0: atH0.asn,
    expectedRemainingH1: atH1.asn,
    expectedRemainingEstimate: atEstimate === null ? null : atEstimate.asn,
  };
}
