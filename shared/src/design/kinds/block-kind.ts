// What a block kind is made of: its name for the maker, its piece kinds
// (roles), the inputs the maker sets, how its pieces are cut, the order it is
// sewn in, its shapes in the drawing and its line in the studio's labour
// minutes. Each kind is one module built with defineBlockKind(); the registry
// (./index.ts) lists them, and derivation, drawing, quoting, the design's
// schema and the design form are all read from it.

import Decimal from 'decimal.js';
import { DomainError } from '../../errors';
import { Length } from '../../measure';
import type { CutSize, RulerStep } from '../../rounding';
import type { UnitCut } from '../../seam-allowance';
import type { WedgeBlock } from '../../wedge-block';
import type { DerivedPiece, DerivedPosition, SewingStep, Template } from '../derivation-types';

interface InputBase {
  /** The field of the stored block (BlockSpec) the input sets. */
  name: string;
  /** The form's label. */
  label: string;
  /** Shown in an empty field. */
  placeholder?: string;
}

/** One thing the maker sets on a block of a kind. Every input is optional in a stored block. */
export type KindInput =
  /** A whole number from min to max; the form starts a new block at `default`. */
  | (InputBase & { type: 'count'; default: number; min: number; max: number })
  /** An exact length in millimetres (a decimal string); left out, the kind works one out from the block. */
  | (InputBase & { type: 'length' })
  /** One of a few named ways; the form starts a new block at `default`. */
  | (InputBase & { type: 'choice'; default: string; options: readonly { value: string; label: string }[] });

/** The value an input stores. */
export type InputValue<I extends KindInput> = I extends { type: 'count' } ? number : I extends { type: 'choice'; options: readonly { value: infer V }[] } ? V : string;

/** The stored fields of a block of one kind: its id, name and kind, and what its inputs set. */
export type KindSpec<K extends string, I extends readonly KindInput[]> = { id: string; name: string; kind: K } & { [N in I[number] as N['name']]?: InputValue<N> };

/** One cut shape of a piece kind: its shape, its cut size and its diagonal cuts. */
export interface CutShape {
  shape: DerivedPiece['shape'];
  width: CutSize;
  height: CutSize;
  diagonalCuts: 0 | 1 | 2;
  piecesEach: number;
  note?: string;
}

/** How a block kind's pieces are cut. */
export interface KindCuts {
  /** Per role: the cut it comes from and how many a number of blocks takes. */
  roles: { role: string; piece: CutShape; perBlock: (blocks: number) => number }[];
  /** Blades cut with templates (plate, fan). */
  wedge?: WedgeBlock;
}

/** The sewing steps of a number of blocks of a kind and how to press them. */
export interface KindSewing {
  steps: SewingStep[];
  pressing: string;
}

/** Adds one polygon (mm corners, before the position's turn) filled by a role's fabric. */
export type AddShape = (points: [number, number][], role: string) => void;

export interface BlockKindDef<K extends string, I extends readonly KindInput[], S = KindSpec<K, I>> {
  kind: K;
  /** The kind's name for the maker, in the design form and on the printouts. */
  label: string;
  /** The piece kinds of a block; every piece of a role takes the role's fabric. */
  roles: readonly string[];
  inputs: I;
  /** The studio's minutes to piece one block (the settings page's row and its default, common practice, rough). */
  labour: { label: string; minutes: number };
  /**
   * A piece that shows whole in the finished top and so can hold a kept feature:
   * its role, and for a block of rails, how many rails from top to bottom.
   */
  wholePiece?: { role: string; rails?(spec: S): number };
  cuts(spec: S, side: Length, opts: { ruler: RulerStep }): KindCuts;
  sewing(spec: S, blocks: number, cuts: KindCuts): KindSewing;
  /** Full-size templates the kind is cut with. */
  templates?(spec: S, cuts: KindCuts): Template[];
  /** The block's shapes at a position, each added with its role. */
  shapes(spec: S, position: DerivedPosition, add: AddShape): void;
}

/** A block kind's module, typed by its own inputs. */
export function defineBlockKind<const K extends string, const I extends readonly KindInput[]>(def: BlockKindDef<K, I>): BlockKindDef<K, I> {
  return def;
}

// Helpers the kinds share.

export const rect = (x: number, y: number, w: number, h: number): [number, number][] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** A stored millimetre length, refused when not above zero. */
export function storedLength(text: string, field: string): Length {
  const d = new Decimal(text);
  if (!d.isFinite() || d.lte(0)) throw new DomainError('not-positive', `Expected ${field} to be above zero.`, field);
  return Length.millimetres(d);
}

/** The cut shape of one piece of a unit cut. */
export function fromUnit(cut: UnitCut, index: number, note?: string): CutShape {
  const p = cut.pieces[index]!;
  return { shape: p.shape, width: p.width, height: p.height, diagonalCuts: p.diagonalCuts, piecesEach: p.piecesEach, note };
}
