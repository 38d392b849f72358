import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';

import { DesignScreen } from './design';
import { DesignsApi } from './designs-api';
import { PrintBar, PrintLoad } from './print-bar';
import { SHEET_AREA_MM, TemplateOutline, templateOutline, templateSizes } from './template-outline';

/** Space round each drawing for its line widths, and below it for its name, mm. */
const PAD_MM = 4;
const LABEL_MM = 7;

interface TemplateSheet {
  id: string;
  name: string;
  sizes: string;
  outline: TemplateOutline;
  /** SVG size and view box, all in millimetres, so one user unit prints as 1 mm. */
  widthMm: number;
  heightMm: number;
  viewBox: string;
  labelY: number;
  tooBig: boolean;
}

/** The full-size templates as a page for paper: each outline at 1:1 in CSS millimetres, with check squares. */
@Component({
  selector: 'ks-templates-print',
  imports: [DatePipe, MatButtonModule, PrintBar],
  templateUrl: './templates-print.html',
  styleUrl: './templates-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TemplatesPrint {
  private readonly api = inject(DesignsApi);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly loaded = new PrintLoad<DesignScreen>(() => this.api.screen(this.commissionId()));
  protected readonly screen = this.loaded.value;
  protected readonly today = new Date();
  protected readonly pad = PAD_MM;

  protected readonly sheets = computed<TemplateSheet[]>(() =>
    (this.screen()?.current?.derived.templates ?? []).map((t) => {
      const outline = templateOutline(t);
      const widthMm = round(outline.widthMm + 2 * PAD_MM);
      const heightMm = round(outline.heightMm + 2 * PAD_MM + LABEL_MM);
      return {
        id: t.id,
        name: t.name,
        sizes: templateSizes(t),
        outline,
        widthMm,
        heightMm,
        viewBox: `${-PAD_MM} ${-PAD_MM} ${widthMm} ${heightMm}`,
        labelY: round(outline.heightMm + PAD_MM + 3),
        tooBig: widthMm > SHEET_AREA_MM.width || heightMm > SHEET_AREA_MM.height,
      };
    }),
  );

  protected pdf(paper: 'a4' | 'letter'): string {
    return this.api.pdf(this.commissionId(), paper === 'a4' ? 'templates-a4' : 'templates-letter');
  }
}

function round(n: number): number {
  return Math.round(n * 1e4) / 1e4;
}
