import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { CutStep, DerivedPiece, Length, PanelPlan, formatCutSize, formatFinishedSize } from '@keepstitch/shared';

import { DesignScreen } from './design';
import { DesignsApi } from './designs-api';

interface SourceSection {
  title: string;
  note: string | null;
  hex: string;
  lines: string[];
  panels: { plan: PanelPlan; label: string; placements: { x: number; y: number; width: number; height: number; n: string }[]; steps: string[] }[];
}

/** The cut list by source as a page made for paper: garments, then studio fabrics, each panel's cuts in order with a diagram. */
@Component({
  selector: 'ks-cut-list-print',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule],
  templateUrl: './cut-list-print.html',
  styleUrl: './cut-list-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutListPrint {
  private readonly api = inject(DesignsApi);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly screen = signal<DesignScreen | null>(null);
  protected readonly failed = signal(false);
  protected readonly today = new Date();
  protected readonly Math = Math;

  protected readonly sections = computed<SourceSection[]>(() => {
    const s = this.screen();
    const v = s?.current;
    if (!s || !v) return [];
    const system = v.body.units;
    const at = (mm: number | string) => formatFinishedSize(Length.millimetres(String(mm)), system);
    const cut = (mm: string) => formatCutSize(Length.millimetres(mm), system);
    const pieces = new Map(v.derived.pieces.map((p) => [p.id, p]));
    const placements = v.plan.plan.placements;
    const hexOf = (key: string) => s.fabrics.find((f) => f.key === key)?.hex ?? '#999';
    const section = (title: string, note: string | null, hex: string, panels: PanelPlan[], label: (p: PanelPlan) => string): SourceSection => {
      const counts = new Map<string, number>();
      for (const pp of panels) for (const pl of placements) if (pl.panelId === pp.panelId) counts.set(pl.pieceId, (counts.get(pl.pieceId) ?? 0) + 1);
      return {
        title,
        note,
        hex,
        lines: [...counts].map(([id, n]) => `${id.slice(1)}: ${pieceLine(pieces.get(id)!, n, cut)}`),
        panels: panels.map((pp) => ({
          plan: pp,
          label: label(pp),
          placements: placements.filter((pl) => pl.panelId === pp.panelId).map((pl) => ({ x: pl.x, y: pl.y, width: pl.width, height: pl.height, n: pl.pieceId.slice(1) })),
          steps: pp.cuts.map((c) => stepText(c, pieces, at)),
        })),
      };
    };
    const out: SourceSection[] = [];
    for (const g of s.garments) {
      const panels = v.plan.plan.panels.filter((p) => p.garmentId === String(g.id) && p.piecesCut > 0);
      if (!panels.length) continue;
      const names = new Map(g.panels.map((p) => [`panel-${p.id}`, p.name]));
      const note = [g.construction === 'knit' ? 'Knit: fuse a stabiliser to the back before cutting.' : '', g.print === 'directional' ? 'Directional print: do not turn the pieces.' : ''].filter(Boolean).join(' ');
      out.push(section(`From the ${g.description}${g.colour ? ` (${g.colour})` : ''}`, note || null, hexOf(`garment:${g.id}`), panels, (p) => `${names.get(p.panelId) ?? p.panelId}, ${at(p.width)} × ${at(p.height)}`));
    }
    for (const st of s.stock) {
      const panels = v.plan.plan.panels.filter((p) => p.fabricId === `stock-${st.id}` && p.piecesCut > 0);
      if (panels.length) out.push(section(`From the studio fabric: ${st.name}`, null, hexOf(`stock:${st.id}`), panels, (p) => `${at(p.width)} wide, ${at(p.height)} of its length`));
    }
    return out;
  });

  constructor() {
    effect(() =>
      this.api.screen(this.commissionId()).subscribe({ next: (s) => this.screen.set(s), error: () => this.failed.set(true) }),
    );
  }

  protected print(): void {
    window.print();
  }

  protected pdf(): string {
    return this.api.pdf(this.commissionId(), 'cut-list');
  }
}

/** "4 x square 12 1/2 in (Block B...)" — the same words as the PDF. */
export function pieceLine(p: DerivedPiece, count: number, cut: (mm: string) => string): string {
  const size = p.widthMm === p.heightMm ? cut(p.widthMm) : `${cut(p.widthMm)} x ${cut(p.heightMm)}`;
  const diagonal = p.diagonalCuts === 1 ? ', cut once on the diagonal' : p.diagonalCuts === 2 ? ', cut twice on the diagonal' : '';
  return `${count} x ${p.shape} ${size} (${p.label})${diagonal}`;
}

export function stepText(step: CutStep, pieces: Map<string, DerivedPiece>, at: (mm: number) => string): string {
  const way = step.direction === 'horizontal' ? 'across' : 'down';
  const from = step.direction === 'horizontal' ? 'from the top' : 'from the left';
  const where = step.region === 'panel' ? 'the panel' : `part ${step.region}`;
  const off = step.cutsOff;
  const what =
    off.content === 'piece'
      ? `piece ${off.pieceId!.slice(1)} (${pieces.get(off.pieceId!)?.label ?? off.pieceId})`
      : off.content === 'strip'
        ? `strip ${off.label}, ${at(off.width)} x ${at(off.height)}`
        : off.content === 'offcut'
          ? `offcut to keep, ${at(off.width)} x ${at(off.height)}`
          : 'waste';
  return `${step.step}. Cut ${where} ${way} at ${at(step.at)} ${from}: ${what}`;
}
