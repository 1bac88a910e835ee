/**
 * The result keys of the Inspect place, chosen for gloved hands and number pads: "+" (the tall key
 * of the number pad, or + on the main keys) takes a passing item, "−" (the number pad's minus, or
 * the main minus once a scan has ended) a nonconforming one. On a count plan "+" takes a clean unit.
 *
 * A barcode scanner types like a keyboard and ends its scan with Enter. Item ids may hold hyphens,
 * so a main-keyboard minus typed into an unfinished id stays part of the id; the number pad's minus
 * never does. A "+" in an item id cannot be typed here: say so where the keys are explained.
 */
export const passKey = { label: '+', spoken: 'plus' } as const;
export const failKey = { label: '−', spoken: 'minus' } as const;

export type KeyedResult = 'pass' | 'fail';

/** Where the key was pressed: the item id field, another text field, or anywhere else on the screen. */
export type KeyTarget = 'item-id' | 'text' | 'elsewhere';

export interface KeyPress {
  readonly key: string;
  readonly code: string;
  readonly ctrlKey?: boolean;
  readonly altKey?: boolean;
  readonly metaKey?: boolean;
}

/**
 * The result a key press records, or null when the key belongs to typing.
 * `scanOpen`: the item id field holds text whose scan has not ended with Enter yet.
 */
export function resultOfKey(press: KeyPress, target: KeyTarget, scanOpen: boolean): KeyedResult | null {
  if (target === 'text' || press.ctrlKey || press.altKey || press.metaKey) return null;
  if (press.key === '+' || press.code === 'NumpadAdd') return 'pass';
  if (press.code === 'NumpadSubtract') return 'fail';
  if (press.key === '-' && !(target === 'item-id' && scanOpen)) return 'fail';
  return null;
}
