/**
 * Keeps keyboard focus somewhere useful when the element holding it leaves the page (a run closes
 * its entry panel on a decision, "All runs" swaps the run for the list, a place opens a run by
 * itself). Without this the browser drops focus to <body> and a keyboard user starts over from the
 * top. The new home is the element marked `data-focus-fallback` when one is shown, else the place's
 * heading (`data-place-heading`).
 */
export function focusFallback(root: ParentNode = document): HTMLElement | null {
  return root.querySelector<HTMLElement>('[data-focus-fallback]') ?? root.querySelector<HTMLElement>('[data-place-heading]');
}

/** Moves focus to the place's heading after the place has been drawn. */
export function focusPlaceHeading(): void {
  requestAnimationFrame(() => document.querySelector<HTMLElement>('main [data-place-heading]')?.focus());
}

/** Watches `stage` for the focused element being removed; returns the teardown. */
export function keepFocusIn(stage: HTMLElement): () => void {
  let lastFocused: Element | null = null;
  const remember = (event: FocusEvent) => {
    lastFocused = event.target instanceof Element ? event.target : null;
  };
  const observer = new MutationObserver(() => {
    const lost = lastFocused !== null && !lastFocused.isConnected;
    const dropped = document.activeElement === null || document.activeElement === document.body;
    if (lost && dropped) {
      lastFocused = null;
      focusFallback(stage)?.focus();
    }
  });
  document.addEventListener('focusin', remember);
  observer.observe(stage, { childList: true, subtree: true });
  return () => {
    document.removeEventListener('focusin', remember);
    observer.disconnect();
  };
}
