/**
 * The Plan place's state, made once for the whole session rather than on every visit: the typed
 * draft, its design and the saved-plan library. The draft and the saved version it came from are
 * kept in local storage, so going to another place or reloading the window loses nothing typed.
 */
import { z } from 'zod';
import { PlanDesignState } from './planDesign.svelte';
import { PlanDraft, type PlanDraftTexts } from './planDraft.svelte';
import { PlanLibrary } from './planLibrary.svelte';

const storageKey = 'tallyline.planDraft/1';

const pair = z.object({ acceptable: z.string(), rejectable: z.string() });
const storedSchema = z.object({
  draft: z.object({
    name: z.string(),
    model: z.enum(['passfail', 'count', 'measurement', 'lifetime', 'graded']),
    countUnit: z.enum(['perUnit', 'per100']),
    quality: z.object({ passfail: pair, count: pair }),
    measurement: z.object({ mu0: z.string(), mu1: z.string(), sigma: z.string(), unit: z.string(), overshootCorrection: z.boolean() }),
    lifetime: z.object({ theta0: z.string(), theta1: z.string(), maxTime: z.string(), maxFailures: z.string() }),
    grades: z.array(z.object({ name: z.string(), p0: z.string(), p1: z.string() })).min(2).max(5),
    producerRisk: z.string(),
    consumerRisk: z.string(),
    truncationMode: z.enum(['none', 'fixed', 'suggested']),
    truncationItems: z.string(),
    fit: z.enum(['wald', 'exact']),
  }),
  /** The saved version the draft was opened from or saved as. */
  opened: z.object({ id: z.string(), version: z.number().int() }).nullable(),
});
type Stored = { draft: PlanDraftTexts; opened: { id: string; version: number } | null };

function readStored(): Stored | null {
  try {
    const text = localStorage.getItem(storageKey);
    if (text === null) return null;
    const parsed = storedSchema.safeParse(JSON.parse(text));
    return parsed.success ? parsed.data : null;
  } catch {
    return null; // storage refused or unreadable: start from the defaults
  }
}

function makeWorkspace() {
  const draft = new PlanDraft();
  const designs = new PlanDesignState();
  const library = new PlanLibrary();
  const stored = readStored();
  if (stored) {
    draft.restore(stored.draft);
    // Shows which saved version the draft came from, without loading that version over the draft.
    if (stored.opened) void library.open(stored.opened.id, stored.opened.version);
  }
  $effect.root(() => {
    $effect(() => {
      const current = library.current;
      const value: Stored = { draft: draft.snapshot(), opened: current ? { id: current.id, version: current.version } : null };
      try {
        localStorage.setItem(storageKey, JSON.stringify(value));
      } catch {
        // A full or refused storage keeps the draft for this session only.
      }
    });
  });
  return { draft, designs, library };
}

export const planWorkspace = makeWorkspace();
