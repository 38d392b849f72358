import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { Block, Figure, KeyFabric, OutlinePoint, PanelFigure, Run, SHEET_AREA_MM, TemplateFigure, Words, templateInnerLine, templateOutline } from '@keepstitch/shared';

import { swatchOf } from './design';
import { QuiltDrawing } from './quilt-drawing';

/** Space round a template's drawing for its line widths, and below it for its name, mm. */
const PAD_MM = 4;
const LABEL_MM = 7;

const round = (n: number) => Math.round(n * 1e4) / 1e4;

/**
 * The blocks of a printout's section as a page for paper: paragraphs, lists,
 * tables and figures, as the content model has them. The page adds no words.
 */
@Component({
  selector: 'ks-printout-blocks',
  imports: [NgTemplateOutlet, QuiltDrawing],
  templateUrl: './printout-blocks.html',
  styleUrl: './printout-blocks.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrintoutBlocks {
  readonly blocks = input.required<readonly Block[]>();
  protected readonly Math = Math;

  protected runs(words: Words): readonly Run[] {
    return typeof words === 'string' ? [{ text: words }] : words;
  }

  protected colours(fabrics: readonly KeyFabric[]): Record<string, string> {
    return Object.fromEntries(fabrics.map((f) => [f.key, f.hex]));
  }

  protected swatch(f: KeyFabric): string {
    return swatchOf({ hex: f.hex, ...(f.stripes ? { stripes: [...f.stripes] } : {}) });
  }

  protected panel(f: Figure): PanelFigure | null {
    return f.kind === 'panel' ? f : null;
  }

  /** A template's outline in an SVG whose user unit is the millimetre, so it prints 1:1. */
  protected sheet(f: TemplateFigure) {
    const o = templateOutline(f.template);
    const points = (list: readonly OutlinePoint[]) => list.map((p) => p.join(',')).join(' ');
    const outline = { ...o, cut: points(o.cut), inner: points(o.inner), innerLabel: templateInnerLine(f.template) };
    const widthMm = round(outline.widthMm + 2 * PAD_MM);
    const heightMm = round(outline.heightMm + 2 * PAD_MM + LABEL_MM);
    return {
      name: f.template.name,
      outline,
      widthMm,
      heightMm,
      viewBox: `${-PAD_MM} ${-PAD_MM} ${widthMm} ${heightMm}`,
      labelY: round(outline.heightMm + PAD_MM + 3),
      tooBig: widthMm > SHEET_AREA_MM.width || heightMm > SHEET_AREA_MM.height,
    };
  }
}
