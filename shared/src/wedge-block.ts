// Radial blocks: a plate of N wedge blades over 360 degrees, or a fan of N
// blades over 90 degrees set in a block corner. With the apex at the centre,
// half-angle h = (sweep / N) / 2, outer radius R, inner radius r and seam
// allowance s, a straight-topped blade grown outward by s on every edge has
//   finished top = 2R sin h, finished bottom = 2r sin h,
//   cut top     = 2R sin h + 2s tan h + 2s / cos h,
//   cut bottom  = 2r sin h - 2s tan h + 2s / cos h,
//   cut height  = (R - r) cos h + 2s  (the strip width to cut blades from).
// R and r are measured to the blade's corners. A pointed blade is cut with a
// straight top, folded in half lengthwise and sewn across the top; turned out,
// its tip sits at the middle of the top seam line, so the tip radius R puts
// the top seam line at distance R from the centre (corner radius R / cos h).

import Decimal from 'decimal.js';
import { DomainError, requireCount } from './errors';
import { Length, requirePositive } from './measure';
import { cutSize, CutSize } from './rounding';
import { AllowanceOptions, resolveAllowance } from './seam-allowance';
import { alternatingPiecesPerStrip } from './strip-yield';

export type WedgeKind = 'plate' | 'fan';
export type BladeTop = 'straight' | 'pointed';

/** A point of a 1:1 template outline in millimetres; origin at the plate centre, the blade along +y. */
export interface TemplatePoint {
  x: number;
  y: number;
}

export const MAX_BLADES = 120;

const PI = Decimal.acos(-1);

export interface WedgeBlockInput extends AllowanceOptions {
  kind: WedgeKind;
  blades: number;
  /** Outer radius: to the blade corners (straight top) or the tip (pointed). Give this or `finishedDiameter`. */
  outerRadius?: Length;
  /** Finished plate diameter (twice the outer radius); for a fan, use `outerRadius`. */
  finishedDiameter?: Length;
  /** Radius of the hole at the centre, to the blades' bottom corners. */
  innerRadius: Length;
  /** Default "straight". */
  top?: BladeTop;
}

export interface WedgeBlock {
  kind: WedgeKind;
  blades: number;
  top: BladeTop;
  sweepDegrees: 360 | 90;
  /** Angle of one blade, sweep / N, in degrees. */
  bladeAngleDegrees: Decimal;
  outerRadius: Length;
  innerRadius: Length;
  allowance: Length;
  finished: {
    /** Width of the blade's top seam line. */
    top: Length;
    bottom: Length;
    /** From the bottom seam line to the top seam line, along the blade's middle. */
    height: Length;
    /** Pointed blades: height of the point above its shoulders. */
    pointHeight: Length | null;
    outline: TemplatePoint[];
  };
  cut: {
    top: CutSize;
    bottom: CutSize;
    /** Cut height of the template; its rounded value is the strip width. */
    height: CutSize;
    outline: TemplatePoint[];
  };
  /** Strip width to cut the blades from (cut height rounded up). */
  stripWidth: CutSize;
}

function halfAngle(kind: WedgeKind, blades: number): Decimal {
  const sweep = kind === 'plate' ? PI.times(2) : PI.dividedBy(2);
  return sweep.dividedBy(blades).dividedBy(2);
}

function point(x: Decimal, y: Decimal): TemplatePoint {
  return { x: x.toDecimalPlaces(6).toNumber(), y: y.toDecimalPlaces(6).toNumber() };
}

/** Finished and cut blade template of a plate or fan block. */
export function wedgeBlock(input: WedgeBlockInput): WedgeBlock {
  if (input.kind !== 'plate' && input.kind !== 'fan') {
    throw new DomainError('out-of-range', `Expected a block kind of "plate" or "fan"; got "${String(input.kind)}".`, 'kind');
  }
  if (typeof input.blades === 'number' && Number.isInteger(input.blades) && input.blades < 3) {
    throw new DomainError('too-few-blades', `Expected at least 3 blades; got ${input.blades}.`, 'blades');
  }
  const blades = requireCount(input.blades, 'blades', 3, MAX_BLADES);
  const top = input.top ?? 'straight';
  let outer: Length;
  if (input.outerRadius !== undefined) {
    outer = requirePositive(input.outerRadius, 'outer radius');
  } else if (input.finishedDiameter !== undefined) {
    outer = requirePositive(input.finishedDiameter, 'finished diameter').dividedBy(2);
  } else {
    throw new DomainError('not-positive', 'Expected an outer radius or a finished diameter.', 'outer radius');
  }
  const inner = requirePositive(input.innerRadius, 'inner radius');
  if (inner.gte(outer)) {
    throw new DomainError(
      'inner-not-less-than-outer',
      `Expected the inner radius (${inner.to('in').toDecimalPlaces(4)} in) to be less than the outer radius (${outer.to('in').toDecimalPlaces(4)} in).`,
      'inner radius',
    );
  }
  const h = halfAngle(input.kind, blades);
  const sin = h.sin();
  const cos = h.cos();
  const tan = h.tan();
  // Top seam line: at R cos h for a straight top; at R (the tip) for a pointed one.
  const topLine = top === 'straight' ? outer.times(cos) : outer;
  const bottomLine = inner.times(cos);
  const finishedHeight = topLine.minus(bottomLine);
  const { allowance, ruler } = resolveAllowance(input, finishedHeight);
  const s = allowance;

  const finishedTop = topLine.times(tan).times(2);
  const finishedBottom = bottomLine.times(tan).times(2);
  const sideGrowth = s.dividedBy(cos); // half-width added by offsetting a side by s, at a fixed height
  const cutTopLine = topLine.plus(s);
  const cutBottomLine = bottomLine.minus(s);
  const cutTop = cutTopLine.times(tan).plus(sideGrowth).times(2);
  const cutBottom = cutBottomLine.times(tan).plus(sideGrowth).times(2);
  const cutHeight = finishedHeight.plus(s.times(2));

  const mm = (l: Length) => l.mm;
  const halfAt = (y: Length) => y.times(tan);
  let finishedOutline: TemplatePoint[];
  let pointHeight: Length | null = null;
  if (top === 'straight') {
    finishedOutline = [
      point(mm(halfAt(bottomLine)).negated(), mm(bottomLine)),
      point(mm(halfAt(bottomLine)), mm(bottomLine)),
      point(mm(halfAt(topLine)), mm(topLine)),
      point(mm(halfAt(topLine)).negated(), mm(topLine)),
    ];
  } else {
    // The fold runs at 45 degrees from the tip to the side seam line: y tan h = T - y.
    const shoulderY = topLine.dividedBy(tan.plus(1));
    const shoulderX = shoulderY.times(tan);
    pointHeight = topLine.minus(shoulderY);
    finishedOutline = [
      point(mm(halfAt(bottomLine)).negated(), mm(bottomLine)),
      point(mm(halfAt(bottomLine)), mm(bottomLine)),
      point(mm(shoulderX), mm(shoulderY)),
      point(new Decimal(0), mm(topLine)),
      point(mm(shoulderX).negated(), mm(shoulderY)),
    ];
  }
  const cutOutline = [
    point(cutBottom.mm.dividedBy(2).negated(), cutBottomLine.mm),
    point(cutBottom.mm.dividedBy(2), cutBottomLine.mm),
    point(cutTop.mm.dividedBy(2), cutTopLine.mm),
    point(cutTop.mm.dividedBy(2).negated(), cutTopLine.mm),
  ];
  const height = cutSize(cutHeight, ruler);
  return {
    kind: input.kind,
    blades,
    top,
    sweepDegrees: input.kind === 'plate' ? 360 : 90,
    bladeAngleDegrees: new Decimal(input.kind === 'plate' ? 360 : 90).dividedBy(blades),
    outerRadius: outer,
    innerRadius: inner,
    allowance,
    finished: { top: finishedTop, bottom: finishedBottom, height: finishedHeight, pointHeight, outline: finishedOutline },
    cut: { top: cutSize(cutTop, ruler), bottom: cutSize(cutBottom, ruler), height, outline: cutOutline },
    stripWidth: height,
  };
}

/**
 * Blades one strip of `stripLength` yields, cut alternately up and down with
 * the template. The strip is cut at the rounded strip width, so the template's
 * slanted sides are extended to the strip's edges before counting.
 */
export function bladesPerStrip(block: WedgeBlock, stripLength: Length): number {
  requirePositive(stripLength, 'strip length');
  const tan = halfAngle(block.kind, block.blades).tan();
  const extra = block.stripWidth.rounded.minus(block.stripWidth.exact).times(tan);
  const wide = block.cut.top.exact.plus(extra);
  const narrow = Length.max(Length.zero, block.cut.bottom.exact.minus(extra));
  return alternatingPiecesPerStrip(wide, narrow, stripLength);
}

export interface BladeStripsPerFabric {
  /** 0-based fabric number in the repeat. */
  fabric: number;
  blades: number;
  strips: number;
}

export interface BladeStrips {
  stripWidth: Length;
  stripLength: Length;
  bladesPerStrip: number;
  perFabric: BladeStripsPerFabric[];
  totalStrips: number;
  /** False when N is not a multiple of K, so two neighbouring blades share a fabric where the repeat wraps. */
  evenRepeat: boolean;
}

/** Strips needed for the block's N blades cut from K fabrics used in turn round the plate or fan. */
export function bladeStrips(block: WedgeBlock, fabrics: number, stripLength: Length): BladeStrips {
  const k = requireCount(fabrics, 'fabrics', 1, block.blades);
  const perStrip = bladesPerStrip(block, stripLength);
  if (perStrip === 0) {
    throw new DomainError('piece-does-not-fit', 'Expected a strip long enough for at least one blade.', 'strip length');
  }
  const perFabric: BladeStripsPerFabric[] = [];
  for (let f = 0; f < k; f++) {
    const blades = Math.floor(block.blades / k) + (f < block.blades % k ? 1 : 0);
    perFabric.push({ fabric: f, blades, strips: Math.ceil(blades / perStrip) });
  }
  const fan = block.kind === 'fan';
  return {
    stripWidth: block.stripWidth.rounded,
    stripLength,
    bladesPerStrip: perStrip,
    perFabric,
    totalStrips: perFabric.reduce((sum, f) => sum + f.strips, 0),
    evenRepeat: fan || block.blades % k === 0,
  };
}
