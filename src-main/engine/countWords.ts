/**
 * The noun for a count in the right number: "failure" for 1, "failures" otherwise.
 *
 * Method: the singular for exactly 1, else the plural (the singular with "s" unless given).
 * References: none (English grammar).
 */
export function countNoun(count: number, singular: string, plural = `${singular}s`): string {
  return count === 1 ? singular : plural;
}

/** A count with its noun in the right number: "1 failure", "2 failures", "1 nonconformity". */
export function countOf(count: number, singular: string, plural = `${singular}s`): string {
  return `${count} ${countNoun(count, singular, plural)}`;
}
