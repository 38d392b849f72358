// Fabric needed for a set of cut pieces, the way a quilter works it out:
// strips cut across the usable width, each strip sub-cut into pieces. Pieces
// of one size share strips; different sizes do not (the leftover of each
// strip is reported). Rotation is tried unless the print is directional.
// A piece's `width` runs across the fabric (selvedge to selvedge) and its
// `height` along the selvedge, as a directional print's "up".

import Decimal from 'decimal.js';
import { DomainError, requireCount } from './errors';
import { DEFAULT_USABLE_WIDTH } from './fabric-width';
import { Length, requirePositive } from './measure';
import { lengthAfterShrinking, lengthBeforeShrinking } from './shrinkage';
import { CutIncrement, CutPurchase, EIGHTH_YARD, PrecutIncrement, roundUpToIncrement, ShopIncrement } from './shop-increment';

export interface PieceRequest {
  /** Cut width (across the fabric when not rotated). */
  width: Length;
  /** Cut height (along the selvedge when not rotated). */
  height: Length;
  quantity: number;
  label?: string;
}

export interface YardageInput {
  pieces: readonly PieceRequest[];
  /** Usable width of the fabric, selvedges off; default 40 in. Ignored for precut increments. */
  usableWidth?: Length;
  /** A one-way print: pieces keep their orientation. Default false. */
  directional?: boolean;
  /** How the shop sells it; default 1/8 yd. */
  increment?: ShopIncrement;
  /** The fabric will be pre-washed and shrinks by this percent both ways; default 0. */
  prewashShrinkPercent?: Decimal.Value;
}

export interface StripGroupPlan {
  label: string;
  quantity: number;
  /** True when the piece is turned a quarter turn (its height runs across the fabric). */
  rotated: boolean;
  /** Width of each strip (measured along the selvedge). */
  stripWidth: Length;
  /** Length of each sub-cut along the strip. */
  subCut: Length;
  piecesPerStrip: number;
  strips: number;
  /** Pieces from the last strip (the others give piecesPerStrip each). */
  lastStripPieces: number;
  /** Fabric left at the end of each full strip. */
  leftoverPerStrip: Length;
  /** strips x strip width. */
  length: Length;
}

export interface PrecutPlan {
  increment: string;
  /** Number of precut pieces to buy. */
  count: number;
  /** Strip widths placed in each precut, in order (each list sums to at most the precut's length). */
  strips: Length[][];
}

export interface YardagePlan {
  usableWidth: Length;
  groups: StripGroupPlan[];
  /** Fabric length needed after any pre-washing (sum of the groups). */
  netLength: Length;
  /** Length to buy before pre-washing shrinks it (equals netLength without shrinkage). */
  grossLength: Length;
  /** Rounded to the shop increment (cut increments). */
  purchase: CutPurchase | null;
  /** Precut pieces needed (precut increments). */
  precuts: PrecutPlan | null;
}

function planGroup(piece: PieceRequest, index: number, usable: Length, directional: boolean): StripGroupPlan {
  const width = requirePositive(piece.width, `piece ${index + 1} width`);
  const height = requirePositive(piece.height, `piece ${index + 1} height`);
  const quantity = requireCount(piece.quantity, `piece ${index + 1} quantity`);
  const label = piece.label ?? `piece ${index + 1}`;
  const options: StripGroupPlan[] = [];
  const orientations: Array<[Length, Length, boolean]> = [[width, height, false]];
  if (!directional && !width.eq(height)) orientations.push([height, width, true]);
  for (const [subCut, stripWidth, rotated] of orientations) {
    if (subCut.gt(usable)) continue;
    const piecesPerStrip = usable.ratio(subCut).floor().toNumber();
    const strips = Math.ceil(quantity / piecesPerStrip);
    options.push({
      label,
      quantity,
      rotated,
      stripWidth,
      subCut,
      piecesPerStrip,
      strips,
      lastStripPieces: quantity - (strips - 1) * piecesPerStrip,
      leftoverPerStrip: usable.minus(subCut.times(piecesPerStrip)),
      length: stripWidth.times(strips),
    });
  }
  if (options.length === 0) {
    throw new DomainError(
      'piece-does-not-fit',
      `${label} (${width.to('in').toDecimalPlaces(3)} x ${height.to('in').toDecimalPlaces(3)} in) is wider than the usable ` +
        `${usable.to('in').toDecimalPlaces(3)} in of fabric${directional ? ' and the print is directional' : ''}; ` +
        'expected pieces that fit across the fabric: piece it, or cut it along the length.',
      'pieces',
    );
  }
  options.sort((a, b) => a.length.compare(b.length));
  return options[0];
}

/** First-fit decreasing: strips into precuts of `capacity` length. */
function packStrips(strips: Length[], capacity: Length): Length[][] {
  const bins: { used: Length; strips: Length[] }[] = [];
  for (const strip of [...strips].sort((a, b) => b.compare(a))) {
    const bin = bins.find((b) => b.used.plus(strip).lte(capacity));
    if (bin) {
      bin.used = bin.used.plus(strip);
      bin.strips.push(strip);
    } else {
      bins.push({ used: strip, strips: [strip] });
    }
  }
  return bins.map((b) => b.strips);
}

function planPrecut(input: YardageInput, increment: PrecutIncrement, shrink: Decimal.Value): YardagePlan {
  const usable = lengthAfterShrinking(increment.width, shrink);
  const capacity = lengthAfterShrinking(increment.length, shrink);
  const groups = input.pieces.map((p, i) => planGroup(p, i, usable, !!input.directional));
  for (const g of groups) {
    if (g.stripWidth.gt(capacity)) {
      throw new DomainError('piece-does-not-fit', `${g.label} is longer than a ${increment.name}.`, 'pieces');
    }
  }
  const strips = groups.flatMap((g) => Array.from({ length: g.strips }, () => g.stripWidth));
  const packed = packStrips(strips, capacity);
  const netLength = Length.sum(groups.map((g) => g.length));
  return {
    usableWidth: usable,
    groups,
    netLength,
    grossLength: lengthBeforeShrinking(netLength, shrink),
    purchase: null,
    precuts: { increment: increment.id, count: packed.length, strips: packed },
  };
}

/**
 * Fabric for the pieces: strips, sub-cuts, leftovers, total length, and the
 * quantity to buy in the shop's increment (with pre-wash shrinkage added).
 */
export function yardage(input: YardageInput): YardagePlan {
  if (input.pieces.length === 0) {
    throw new DomainError('not-positive', 'Expected at least one piece to cut.', 'pieces');
  }
  const increment = input.increment ?? EIGHTH_YARD;
  const shrink = input.prewashShrinkPercent ?? 0;
  if (increment.kind === 'precut') return planPrecut(input, increment, shrink);
  const usable = lengthAfterShrinking(requirePositive(input.usableWidth ?? DEFAULT_USABLE_WIDTH, 'usable width'), shrink);
  const groups = input.pieces.map((p, i) => planGroup(p, i, usable, !!input.directional));
  const netLength = Length.sum(groups.map((g) => g.length));
  const grossLength = lengthBeforeShrinking(netLength, shrink);
  return {
    usableWidth: usable,
    groups,
    netLength,
    grossLength,
    purchase: roundUpToIncrement(grossLength, increment as CutIncrement),
    precuts: null,
  };
}
