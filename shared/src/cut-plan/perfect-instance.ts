// Perfect-packing instances: the project's own recursive-cut construction. A
// sheet is cut into pieces by random straight cuts, each from edge to edge of
// the piece it is made in, so the pieces fill the sheet exactly and a 100%
// fill with guillotine (edge-to-edge) cuts exists by construction. These are
// not any published benchmark set, and nothing is claimed here about how
// published perfect-packing sets were made or whether they can be cut edge to
// edge (no source for that is at hand).

export interface PerfectInstance {
  width: number;
  height: number;
  pieces: { width: number; height: number }[];
}

/** A small seeded generator (mulberry32) so the same seed gives the same instance. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Cuts a width x height sheet (whole units) into `count` rectangles by
 * repeatedly cutting a random piece straight across, at a whole unit, until
 * there are `count` pieces or no piece is at least 2 units in any side.
 * Sides stay at least `minSide`.
 */
export function perfectInstance(seed: number, width: number, height: number, count: number, minSide = 1): PerfectInstance {
  const random = seededRandom(seed);
  const pieces = [{ width, height }];
  let attempts = 0;
  while (pieces.length < count && attempts < count * 50) {
    attempts++;
    // Prefer larger pieces to cut, as a uniform choice leaves slivers.
    const i = Math.floor(random() * pieces.length);
    const j = Math.floor(random() * pieces.length);
    const pick = pieces[i].width * pieces[i].height >= pieces[j].width * pieces[j].height ? i : j;
    const piece = pieces[pick];
    const across = piece.height > piece.width ? random() < 0.75 : random() < 0.25;
    const side = across ? piece.height : piece.width;
    if (side < 2 * minSide) continue;
    const at = minSide + Math.floor(random() * (side - 2 * minSide + 1));
    const [a, b] = across
      ? [{ width: piece.width, height: at }, { width: piece.width, height: piece.height - at }]
      : [{ width: at, height: piece.height }, { width: piece.width - at, height: piece.height }];
    pieces.splice(pick, 1, a, b);
  }
  return { width, height, pieces };
}
