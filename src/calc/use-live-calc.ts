/**
 * Runs shared/calc in the browser as the person types: the first result is computed at once (so the
 * static page already carries numbers), later ones after a short pause in typing (debounce), so a burst
 * of keystrokes costs one calculation.
 */
import { useEffect, useRef, useState } from 'react';

import { evaluateDraft, type LiveOutput } from './live';
import type { Draft } from './quick-case';
import type { UnitSystem } from './units';

export const LIVE_CALC_DEBOUNCE_MS = 150;

export type LiveCalc = {
  output: LiveOutput;
  /** True between an edit and the calculation that follows it. */
  pending: boolean;
  /** The draft the output belongs to (it lags the current draft while pending). */
  forDraft: Draft;
};

export function useLiveCalc(draft: Draft, system: UnitSystem, delayMs = LIVE_CALC_DEBOUNCE_MS): LiveCalc {
  const [computed, setComputed] = useState<{ output: LiveOutput; forDraft: Draft }>(() => ({ output: evaluateDraft(draft, system), forDraft: draft }));
  const [pending, setPending] = useState(false);
  const first = useRef(true);

  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    setPending(true);
    const timer = setTimeout(() => {
      setComputed({ output: evaluateDraft(draft, system), forDraft: draft });
      setPending(false);
    }, delayMs);
    return () => clearTimeout(timer);
  }, [draft, system, delayMs]);

  return { output: computed.output, forDraft: computed.forDraft, pending: pending || computed.forDraft !== draft };
}
