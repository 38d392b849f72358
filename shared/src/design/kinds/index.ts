// The block kinds a design may use, in the order the design form and the
// settings page list them. A new kind is one module (see block-kind.ts) added
// to this list; everything else reads it from here.

import type { BlockKindDef, InputValue, KindInput } from './block-kind';
import { square } from './square';
import { rectangles } from './rectangles';
import { hst } from './hst';
import { qst } from './qst';
import { flyingGeese } from './flying-geese';
import { foundation } from './foundation';
import { plate } from './plate';
import { fan } from './fan';

const KIND_LIST = [square, rectangles, hst, qst, flyingGeese, foundation, plate, fan] as const;

type KindModule = (typeof KIND_LIST)[number];

/** The kinds of block a design may use. */
export type BlockKind = KindModule['kind'];

type AllInputs = KindModule['inputs'][number];

/** What the inputs of every kind may set on a stored block, each optional. */
export type BlockParams = { [I in AllInputs as I['name']]?: InputValue<I> };

/** A block of the design: its id and name, its kind, and what the kind's inputs set (kinds/). */
export interface BlockSpec extends BlockParams {
  /** Short id used by the pattern and assignments, e.g. "A". */
  id: string;
  name: string;
  kind: BlockKind;
}

/** A block kind's module, read through the registry: its methods take any stored block of the kind. */
export type BlockKindModule = BlockKindDef<BlockKind, readonly KindInput[], BlockSpec>;

export const BLOCK_KIND_MODULES: readonly BlockKindModule[] = KIND_LIST;

const byKind = new Map<string, BlockKindModule>(KIND_LIST.map((k) => [k.kind, k]));

/** The module of a kind; undefined for a kind the registry does not have. */
export function blockKindOf(kind: string): BlockKindModule | undefined {
  return byKind.get(kind);
}

/** The module of a stored block's kind. */
export function blockKind(kind: BlockKind): BlockKindModule {
  return byKind.get(kind)!;
}

export const BLOCK_KINDS: readonly BlockKind[] = KIND_LIST.map((k) => k.kind);

export const BLOCK_KIND_LABELS = Object.fromEntries(KIND_LIST.map((k) => [k.kind, k.label])) as Readonly<Record<BlockKind, string>>;

/** The piece kinds ("roles") of each block kind. */
export const BLOCK_ROLES = Object.fromEntries(KIND_LIST.map((k) => [k.kind, k.roles])) as Readonly<Record<BlockKind, readonly string[]>>;

/**
 * Every input of any kind, by the stored field it sets. Kinds that share a
 * field (rails, units each way and geese all set `units`) declare it alike
 * but for its label and default; the design's schema checks each field once.
 */
export function blockInputsByName(): Map<string, KindInput[]> {
  const out = new Map<string, KindInput[]>();
  for (const k of KIND_LIST) for (const i of k.inputs as readonly KindInput[]) out.set(i.name, [...(out.get(i.name) ?? []), i]);
  return out;
}

export type { BlockKindDef, KindInput, KindCuts, KindSewing, CutShape, AddShape } from './block-kind';
