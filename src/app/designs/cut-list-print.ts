import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { CutRegion, Length, PanelPlan, designDrawing, formatCutSize, formatFinishedSize, keptFeatureId, keptFeaturePieces, keptFeaturePlaces, keptLines, pieceLine, pieceNumber, stepText } from '@keepstitch/shared';

import { DesignScreen, swatchOf } from './design';
import { DesignsApi } from './designs-api';
import { PrintBar, PrintLoad } from './print-bar';
import { QuiltDrawing } from './quilt-drawing';

interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

interface SourceSection {
  title: string;
  note: string | null;
  hex: string;
  lines: { text: string; kept: string[] }[];
  panels: {
    plan: PanelPlan;
    label: string;
    placements: (Rect & { n: string; kept: string | null; feature: Rect | null })[];
    steps: { text: string; kept: boolean }[];
  }[];
}

/**
 * The cut list by source as a page made for paper: the top with its fabrics
 * and kept features, then garments and studio fabrics, each panel's cuts in
 * order with a diagram. The piece cut around a kept feature is said to be so
 * in its line, its cut and its diagram, in words and outlines that need no colour.
 */
@Component({
  selector: 'ks-cut-list-print',
  imports: [DatePipe, MatButtonModule, PrintBar, QuiltDrawing],
  templateUrl: './cut-list-print.html',
  styleUrl: './cut-list-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutListPrint {
  private readonly api = inject(DesignsApi);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly loaded = new PrintLoad<DesignScreen>(() => this.api.screen(this.commissionId()));
  protected readonly screen = this.loaded.value;
  protected readonly today = new Date();
  protected readonly Math = Math;
  protected readonly swatch = swatchOf;

  protected readonly colours = computed(() => Object.fromEntries((this.screen()?.fabrics ?? []).map((f) => [f.key, f.hex])) as Record<string, string>);
  /** Each kept feature the plan holds, with the block it goes in. */
  protected readonly kept = computed(() => {
    const v = this.screen()?.current;
    return v ? keptFeaturePlaces(v.body, v.derived, keptFeaturePieces(v.plan)) : [];
  });
  /** The fabrics the top shows, for its key. */
  protected readonly topFabrics = computed(() => {
    const s = this.screen();
    const v = s?.current;
    if (!s || !v) return [];
    const shown = new Set(designDrawing(v.body, v.derived).shapes.map((x) => x.fill));
    const known = s.fabrics.filter((f) => shown.has(f.key)).map((f) => ({ key: f.key, name: f.kind === 'group' ? `${f.name} (a group: stripes of its garments)` : f.name, swatch: swatchOf(f) }));
    return shown.has('any') ? [...known, { key: 'any', name: 'Planner chooses (any garment)', swatch: 'repeating-linear-gradient(45deg, #f1efe8 0 4px, #d8d3c4 4px 6px)' }] : known;
  });

  protected readonly sections = computed<SourceSection[]>(() => {
    const s = this.screen();
    const v = s?.current;
    if (!s || !v) return [];
    const system = v.body.units;
    const at = (mm: number | string) => formatFinishedSize(Length.millimetres(String(mm)), system);
    const cut = (mm: string) => formatCutSize(Length.millimetres(mm), system);
    const pieces = new Map(v.derived.pieces.map((p) => [p.id, p]));
    const placements = v.plan.plan.placements;
    const kept = this.kept();
    const features = new Map(s.garments.flatMap((g) => g.panels.flatMap((p) => (p.features ?? []).map((f, i) => [keptFeatureId(p.id, i), f] as const))));
    const hexOf = (key: string) => s.fabrics.find((f) => f.key === key)?.hex ?? '#999';
    const section = (title: string, note: string | null, hex: string, panels: PanelPlan[], label: (p: PanelPlan) => string, garmentId: number | null): SourceSection => {
      const here = kept.filter((k) => k.garmentId === garmentId);
      const holds = (r: CutRegion) => r.content === 'piece' && here.some((k) => k.pieceId === r.pieceId && k.copy === r.copy);
      const counts = new Map<string, number>();
      for (const pp of panels) for (const pl of placements) if (pl.panelId === pp.panelId) counts.set(pl.pieceId, (counts.get(pl.pieceId) ?? 0) + 1);
      return {
        title,
        note,
        hex,
        lines: [...counts].map(([id, n]) => ({ text: `${pieceNumber(id)}: ${pieceLine(pieces.get(id)!, n, cut)}`, kept: keptLines(id, here) })),
        panels: panels.map((pp) => ({
          plan: pp,
          label: label(pp),
          placements: placements
            .filter((pl) => pl.panelId === pp.panelId)
            .map((pl) => {
              const held = here.find((k) => k.pieceId === pl.pieceId && k.copy === pl.copy);
              const f = pl.featureId !== undefined ? features.get(pl.featureId) : undefined;
              return {
                x: pl.x,
                y: pl.y,
                width: pl.width,
                height: pl.height,
                n: pieceNumber(pl.pieceId),
                kept: held ? `Piece ${pieceNumber(pl.pieceId)} keeps the ${held.feature}` : null,
                feature: f ? { x: Number(f.xMm), y: Number(f.yMm), width: Number(f.widthMm), height: Number(f.heightMm) } : null,
              };
            }),
          steps: pp.cuts.map((c) => ({ text: stepText(c, pieces, at, here), kept: holds(c.cutsOff) || holds(c.remaining) })),
        })),
      };
    };
    const out: SourceSection[] = [];
    for (const g of s.garments) {
      const panels = v.plan.plan.panels.filter((p) => p.garmentId === String(g.id) && p.piecesCut > 0);
      if (!panels.length) continue;
      const names = new Map(g.panels.map((p) => [`panel-${p.id}`, p.name]));
      const note = [g.construction === 'knit' ? 'Knit: fuse a stabiliser to the back before cutting.' : '', g.print === 'directional' ? 'Directional print: do not turn the pieces.' : ''].filter(Boolean).join(' ');
      out.push(section(`From the ${g.description}${g.colour ? ` (${g.colour})` : ''}`, note || null, hexOf(`garment:${g.id}`), panels, (p) => `${names.get(p.panelId) ?? p.panelId}, ${at(p.width)} × ${at(p.height)}`, g.id));
    }
    for (const st of s.stock) {
      const panels = v.plan.plan.panels.filter((p) => p.fabricId === `stock-${st.id}` && p.piecesCut > 0);
      if (panels.length) out.push(section(`From the studio fabric: ${st.name}`, null, hexOf(`stock:${st.id}`), panels, (p) => `${at(p.width)} wide, ${at(p.height)} of its length`, null));
    }
    return out;
  });

  protected pdf(): string {
    return this.api.pdf(this.commissionId(), 'cut-list');
  }
}
