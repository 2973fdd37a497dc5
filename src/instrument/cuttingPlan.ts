/** Pieces assigned to one stock bar, and what is left of it (mm). */
export interface StockBarUse {
  /** Labels of the pieces cut from this bar, longest first. */
  pieces: string[];
  used_mm: number;
  offcut_mm: number;
}

/** A cutting plan: the stock bars used and any piece too long for the stock. */
export interface CuttingPlan {
  bars: StockBarUse[];
  too_long: string[];
}

/**
 * Assigns pieces (mm) to stock bars of `stockLengthMm` by first-fit decreasing (longest piece
 * into the first bar with room, a saw kerf after each piece): a simple bin-packing heuristic
 * that never uses more than 11/9 of the optimum plus one bar (Johnson 1973; a classic bound).
 */
export function cuttingPlan(pieces: readonly { label: string; length_mm: number }[], stockLengthMm: number, kerfMm: number): CuttingPlan {
  const sorted = [...pieces].sort((a, b) => b.length_mm - a.length_mm);
  const bars: StockBarUse[] = [];
  const tooLong: string[] = [];
  for (const piece of sorted) {
    if (piece.length_mm > stockLengthMm) {
      tooLong.push(piece.label);
      continue;
    }
    const need = (bar: StockBarUse) => bar.used_mm + (bar.pieces.length > 0 ? kerfMm : 0) + piece.length_mm;
    let bar = bars.find((b) => need(b) <= stockLengthMm);
    if (!bar) {
      bar = { pieces: [], used_mm: 0, offcut_mm: stockLengthMm };
      bars.push(bar);
    }
    bar.used_mm = Math.round(need(bar) * 1000) / 1000;
    bar.pieces.push(piece.label);
    bar.offcut_mm = Math.round((stockLengthMm - bar.used_mm) * 1000) / 1000;
  }
  return { bars, too_long: tooLong };
}
