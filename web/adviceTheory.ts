// The model the tuning view's next-cut advice is worked out on: the line model (quick) or the 3D
// model as well (about 20 seconds a round). The maker's choice, remembered in this browser.

/** 'line': nextCut; 'solid': nextCutSolid (the 3D model fits the wood and, closing in, plans the cut). */
export type AdviceTheory = 'line' | 'solid';

const storageKey = 'barwright.advice-theory';

/** The choice made last in this browser ('line' when none was made or storage is closed). */
export function rememberedAdviceTheory(): AdviceTheory {
  try {
    return localStorage.getItem(storageKey) === 'solid' ? 'solid' : 'line';
  } catch {
    return 'line';
  }
}

/** Keeps the choice for the next advice in this browser. */
export function rememberAdviceTheory(theory: AdviceTheory): void {
  try {
    localStorage.setItem(storageKey, theory);
  } catch {
    // Private windows may refuse storage: the choice then lasts as long as the page.
  }
}
