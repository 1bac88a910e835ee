/**
 * The result keys of the Inspect place, chosen for gloved hands and number pads.
 *
 * The rule, as the screen and the README state it:
 * - the number pad's + records a passing item and its − a nonconforming one, wherever the focus is
 *   except in Category, Note and the other text fields (the Item id field included: a scanner never
 *   types the number pad's keys, so they cannot be part of an id);
 * - the main keyboard's + and - record only when no field has the focus; in the Item id field they
 *   type, so ids may hold hyphens;
 * - Enter in Item id ends a scan and records nothing.
 * On a count plan + records a clean unit and − records nothing.
 */
export const passKey = { label: '+', spoken: 'plus' } as const;
export const failKey = { label: '−', spoken: 'minus' } as const;

export type KeyedResult = 'pass' | 'fail';

/** Where the key was pressed: the item id (or count) field, another text field, or no field at all. */
export type KeyTarget = 'item-id' | 'text' | 'elsewhere';

export interface KeyPress {
  readonly key: string;
  readonly code: string;
  readonly ctrlKey?: boolean;
  readonly altKey?: boolean;
  readonly metaKey?: boolean;
}

/** The result a key press records, or null when the key belongs to typing (or to nothing). */
export function resultOfKey(press: KeyPress, target: KeyTarget): KeyedResult | null {
  if (target === 'text' || press.ctrlKey || press.altKey || press.metaKey) return null;
  if (press.code === 'NumpadAdd') return 'pass';
  if (press.code === 'NumpadSubtract') return 'fail';
  if (target === 'item-id') return null;
  if (press.key === '+') return 'pass';
  if (press.key === '-' || press.key === '−') return 'fail';
  return null;
}
