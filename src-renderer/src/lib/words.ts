/** Small wording rules shared by every place. */

/**
 * A count with its noun in the right number: "1 item", "2 items". `plural` is the noun as the
 * places name what they count (items, units, measurements, readings, runs), each a plain -s plural.
 */
export function countOf(count: number, plural: string): string {
  return `${count} ${count === 1 ? plural.replace(/s$/, '') : plural}`;
}

/**
 * A decision rule as the engine states it for files ("count 0 <= acceptance number 0 at n = 6"),
 * written for people with the proper signs: ≤, ≥ and ×.
 */
export function ruleText(rule: string): string {
  return rule.replaceAll(' <= ', ' ≤ ').replaceAll(' >= ', ' ≥ ').replaceAll(' x ', ' × ');
}
