// What a printout says, once, for the print page and the PDF alike: a title,
// the lines under it, then headed sections of paragraphs, lists, tables and
// figures (the quilt top, a panel's cuts, a full-size template). The page and
// the PDF only draw it; neither adds words of its own.

import type { DesignBody } from '../design/design-body';
import type { DesignDerivation } from '../design/derive-design';
import type { KeptFeaturePlace } from '../design/kept-feature-places';
import type { Template } from '../design/derive-design';

/** A stretch of words, bold or not. */
export interface Run {
  text: string;
  bold?: boolean;
}

/** Words as a printout says them: plain text, or runs of which some are bold. */
export type Words = string | readonly Run[];

/** The plain text of some words. */
export function wordsText(words: Words): string {
  return typeof words === 'string' ? words : words.map((r) => r.text).join('');
}

/**
 * How a paragraph or section stands out: `note` a caution to heed while
 * cutting, `alert` a safety or shortfall matter, `quiet` a side remark, `small`
 * a source or footnote.
 */
export type Tone = 'note' | 'alert' | 'quiet' | 'small';

/** Where a block appears: both (the default), or only on the page or only in the PDF, when it speaks of that medium. */
export type Medium = 'page' | 'pdf';

/** A line of a list, with any notes under it ("Kept feature: ...") and a count after it ("[10]"). */
export interface ListItem {
  text: Words;
  /** How many times a step is done, printed after it. */
  count?: number;
  notes?: readonly { label: string; text: string }[];
  /** Stands out: the cut that frees the piece holding a kept feature. */
  emphasis?: boolean;
}

/** A fabric of a drawing's key: its colour, or the stripes of a group's garments. */
export interface KeyFabric {
  key: string;
  name: string;
  hex: string;
  stripes?: readonly string[];
}

/** The quilt top to scale, each shape in its fabric, with its key of fabrics and kept features. */
export interface QuiltTopFigure {
  kind: 'quilt-top';
  body: DesignBody;
  derived: DesignDerivation;
  /** Every fabric the design may name, for the shapes' colours. */
  fabrics: readonly KeyFabric[];
  /** The fabrics the drawing shows, in the key's order. */
  key: readonly KeyFabric[];
  kept: readonly KeptFeaturePlace[];
  /** One line for each kept feature's mark. */
  keptKey: readonly string[];
}

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** A garment panel or a studio fabric to scale, in its own millimetres, with the pieces laid on it. */
export interface PanelFigure {
  kind: 'panel';
  width: number;
  height: number;
  /** The source's colour, for its pieces. */
  hex: string;
  pieces: readonly (Rect & {
    /** The piece's number in the cut list. */
    label: string;
    /** "Piece 8 keeps the breast pocket" when it holds a kept feature. */
    kept: string | null;
    /** The kept feature's outline where it lies on the panel. */
    feature: Rect | null;
  })[];
}

/** A template drawn full size, with the words for when it is larger than a sheet. */
export interface TemplateFigure {
  kind: 'template';
  template: Template;
  /** For a page, which cannot tile: where to print a template too big for one sheet. */
  tooBig: string;
  /** For a PDF that tiles it: how to put the tiles together. */
  tiles: string;
}

/** Squares to measure, to be sure the printer kept the scale. */
export interface CheckSquaresFigure {
  kind: 'check-squares';
  squares: readonly { mm: number; name: string; label: string; text: string }[];
}

export type Figure = QuiltTopFigure | PanelFigure | TemplateFigure | CheckSquaresFigure;

export type Block = (
  | { kind: 'paragraph'; text: Words; tone?: Tone }
  /** `itemMark` marks each line of the list as `mark` marks the whole. */
  | { kind: 'list'; style: 'bullets' | 'lines' | 'steps'; items: readonly ListItem[]; itemMark?: string }
  | { kind: 'table'; head: readonly string[]; rows: readonly (readonly string[])[] }
  /** A figure, with a title and lines beside it (a panel's cuts). */
  | { kind: 'figure'; figure: Figure; title?: string; beside?: readonly ListItem[] }
  /** Blocks kept together under a small heading (a safety notice). */
  | { kind: 'group'; heading: string; blocks: readonly Block[] }
) & {
  /** A name the page marks the block with (`data-testid`), so people and tests can find it. */
  mark?: string;
  only?: Medium;
};

export interface Section {
  heading?: string;
  tone?: Tone;
  /** A name the page marks the section with (`data-testid`). */
  mark?: string;
  blocks: readonly Block[];
}

/** A printout's whole content. */
export interface PrintoutContent {
  title: string;
  /** Lines under the title: the commission, the version, the date, how to read it. */
  meta: readonly string[];
  sections: readonly Section[];
  /**
   * `flow`: sections run on one after another. `sheets`: each section is a
   * sheet of its own (a full-size template, tiled when larger), and any check
   * squares are repeated at the foot of every sheet.
   */
  layout: 'flow' | 'sheets';
}

/** Every figure of a printout, in order. */
export function contentFigures(content: PrintoutContent): Figure[] {
  const inBlocks = (blocks: readonly Block[]): Figure[] => blocks.flatMap((b) => (b.kind === 'figure' ? [b.figure] : b.kind === 'group' ? inBlocks(b.blocks) : []));
  return content.sections.flatMap((s) => inBlocks(s.blocks));
}

/** Every word of a printout a medium shows, in reading order: for comparing what the page and the PDF say. */
export function contentWords(content: PrintoutContent, medium: Medium): string[] {
  const item = (i: ListItem) => [wordsText(i.text), ...(i.notes ?? []).map((n) => `${n.label} ${n.text}`)];
  const figure = (f: Figure): string[] =>
    f.kind === 'quilt-top' ? [...f.key.map((k) => k.name), ...f.keptKey] : f.kind === 'check-squares' ? f.squares.flatMap((s) => [s.label, s.text]) : [];
  const blocks = (list: readonly Block[]): string[] =>
    list.flatMap((b) => {
      if (b.only && b.only !== medium) return [];
      switch (b.kind) {
        case 'paragraph':
          return [wordsText(b.text)];
        case 'list':
          return b.items.flatMap(item);
        case 'table':
          return [...b.head, ...b.rows.flat()];
        case 'figure':
          return [...(b.title ? [b.title] : []), ...figure(b.figure), ...(b.beside ?? []).flatMap(item)];
        case 'group':
          return [b.heading, ...blocks(b.blocks)];
      }
    });
  return [content.title, ...content.meta, ...content.sections.flatMap((s) => [...(s.heading ? [s.heading] : []), ...blocks(s.blocks)])];
}
