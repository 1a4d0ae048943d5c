import type { Dec } from '../../src/shared/decimal';

export interface LadderRung {
  id: string;
  /** The price on the menu now; a size without one is left as chosen. */
  current: Dec | null;
  /** The price chosen for it (null or equal to current = kept). */
  chosen: Dec | null;
}

/**
 * Keeps a drink's price ladder tidy: every size moves by the same amount, so the step between
 * sizes stays what the owner set. The amount is the largest change chosen for any size, so no
 * size ends below the price chosen for it (a size that fell below target and took the
 * suggested price keeps at least that). Sizes without a current price keep what was chosen.
 * Common practice, no source: cafés keep equal gaps between sizes so the menu reads simply.
 */
export function keepLadder(rungs: readonly LadderRung[]): Map<string, Dec | null> {
  const priced = rungs.filter((r) => r.current !== null);
  let delta: Dec | null = null;
  for (const r of priced) {
    const d = (r.chosen ?? (r.current as Dec)).minus(r.current as Dec);
    if (delta === null || d.gt(delta)) delta = d;
  }
  const out = new Map<string, Dec | null>();
  for (const r of rungs) {
    out.set(r.id, r.current === null || delta === null ? r.chosen : r.current.plus(delta));
  }
  return out;
}
