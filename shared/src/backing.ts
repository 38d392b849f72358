// Backing: larger than the quilt top on every side (common practice 4 in,
// some say 6 in), cut whole from wide backing (108 in) or pieced from
// width-of-fabric panels with the seams running the way that uses least
// fabric.

import { DomainError } from './errors';
import { DEFAULT_USABLE_WIDTH, WIDE_BACKING_WIDTH } from './fabric-width';
import { Length, requireNonNegative, requirePositive, Size } from './measure';
import { CutIncrement, CutPurchase, EIGHTH_YARD, roundUpToIncrement } from './shop-increment';

export const DEFAULT_BACKING_OVERSIZE: Length = Length.inches(4);
/** Common practice: backing panels are joined with a 1/2 in seam pressed open. */
export const DEFAULT_BACKING_SEAM: Length = Length.inches('0.5');

export type BackingMethod = 'single-width' | 'seams-along-length' | 'seams-across-width';

export interface BackingOption {
  fabric: 'width-of-fabric' | 'wide-backing';
  method: BackingMethod;
  /** Panels joined side by side. */
  panels: number;
  seams: number;
  /** Length of each panel as cut off the bolt. */
  panelLength: Length;
  /** panels x panel length. */
  fabricLength: Length;
  purchase: CutPurchase;
}

export interface BackingInput {
  /** Finished quilt top size. */
  quilt: Size;
  /** Extra on every side; default 4 in. */
  oversize?: Length;
  /** Usable width of the regular fabric; default 40 in. */
  usableWidth?: Length;
  /** Usable width of wide backing; default 108 in. */
  wideWidth?: Length;
  /** Seam allowance on panel joins; default 1/2 in. */
  seamAllowance?: Length;
  increment?: CutIncrement;
}

export interface BackingPlan {
  /** Quilt + 2 x oversize each way. */
  required: Size;
  /** The pieced width-of-fabric option using least fabric. */
  pieced: BackingOption;
  /** The other pieced orientation, for comparison. */
  alternative: BackingOption | null;
  /** Cut from wide backing, when the required size fits it (one way or the other). */
  wide: BackingOption | null;
}

/** Panels of `usable` joined with `seam` allowances to cover `across`. */
function panelsFor(across: Length, usable: Length, seam: Length): number {
  if (across.lte(usable)) return 1;
  return across.minus(seam.times(2)).ratio(usable.minus(seam.times(2))).ceil().toNumber();
}

function option(
  fabric: BackingOption['fabric'],
  across: Length,
  along: Length,
  usable: Length,
  seam: Length,
  seamsAlongLength: boolean,
  increment: CutIncrement,
): BackingOption {
  const panels = panelsFor(across, usable, seam);
  const fabricLength = along.times(panels);
  return {
    fabric,
    method: panels === 1 ? 'single-width' : seamsAlongLength ? 'seams-along-length' : 'seams-across-width',
    panels,
    seams: panels - 1,
    panelLength: along,
    fabricLength,
    purchase: roundUpToIncrement(fabricLength, increment),
  };
}

/** Backing size and how to make it from regular or wide fabric. */
export function backing(input: BackingInput): BackingPlan {
  const width = requirePositive(input.quilt.width, 'quilt width');
  const height = requirePositive(input.quilt.height, 'quilt length');
  const oversize = requireNonNegative(input.oversize ?? DEFAULT_BACKING_OVERSIZE, 'oversize');
  const usable = requirePositive(input.usableWidth ?? DEFAULT_USABLE_WIDTH, 'usable width');
  const wideWidth = requirePositive(input.wideWidth ?? WIDE_BACKING_WIDTH, 'wide backing width');
  const seam = requirePositive(input.seamAllowance ?? DEFAULT_BACKING_SEAM, 'seam allowance');
  if (usable.lte(seam.times(4))) {
    throw new DomainError('too-small', 'Expected a usable fabric width larger than four seam allowances.', 'usable width');
  }
  const increment = input.increment ?? EIGHTH_YARD;
  const required = { width: width.plus(oversize.times(2)), height: height.plus(oversize.times(2)) };

  // Seams along the length: panels hang top to bottom and sit side by side across the width.
  const along = option('width-of-fabric', required.width, required.height, usable, seam, true, increment);
  const across = option('width-of-fabric', required.height, required.width, usable, seam, false, increment);
  const [pieced, other] = along.fabricLength.lte(across.fabricLength) ? [along, across] : [across, along];

  const wideChoices = [
    option('wide-backing', required.width, required.height, wideWidth, seam, true, increment),
    option('wide-backing', required.height, required.width, wideWidth, seam, false, increment),
  ].filter((o) => o.panels === 1);
  wideChoices.sort((a, b) => a.fabricLength.compare(b.fabricLength));

  return {
    required,
    pieced,
    alternative: pieced.panels === 1 && other.panels === 1 && other.fabricLength.eq(pieced.fabricLength) ? null : other,
    wide: wideChoices[0] ?? null,
  };
}
