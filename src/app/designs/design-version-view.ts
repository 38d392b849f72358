import { DatePipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { BLOCK_KIND_LABELS, Length, MATTRESS_PRESETS, designKeptFeatures, formatLength } from '@keepstitch/shared';

import { DesignVersion } from './design';
import { QuiltDrawing } from './quilt-drawing';

const both = (mm: string) => `${formatLength(Length.millimetres(mm), 'imperial')} (${formatLength(Length.millimetres(mm), 'metric')})`;

/** A saved version of a design, as it was stored: read only, nothing on it can be changed. */
@Component({
  selector: 'ks-design-version-view',
  imports: [DatePipe, PercentPipe, MatButtonModule, QuiltDrawing],
  template: `
    @let v = version();
    <section class="version" [attr.aria-labelledby]="'version-' + v.version + '-heading'" data-testid="version-view">
      <div class="head">
        <h3 [id]="'version-' + v.version + '-heading'">Version {{ v.version }} (read only)</h3>
        <button mat-stroked-button type="button" (click)="closed.emit()">Close version {{ v.version }}</button>
      </div>
      <p>Saved {{ v.createdAt | date: 'd MMM y, HH:mm' }}{{ v.note ? ': ' + v.note : '.' }}
        @if (v.sharedAt) { Shared with the client {{ v.sharedAt | date: 'd MMM y' }}. }
        @if (v.clientResponse) { The client {{ v.clientResponse === 'approved' ? 'approved it' : 'asked for a change' }}{{ v.clientNote ? ': “' + v.clientNote + '”' : '.' }} }
      </p>
      <div class="body">
        <ks-quilt-drawing [body]="v.body" [derived]="v.derived" [colours]="colours()" [kept]="kept()" />
        <dl class="facts" data-testid="version-facts">
          <div><dt>Finished</dt><dd>{{ size().finished }}</dd></div>
          <div><dt>Target</dt><dd>{{ size().target }}{{ preset() }}</dd></div>
          <div><dt>Layout</dt><dd>{{ layout() }}</dd></div>
          <div><dt>Blocks</dt><dd>@for (b of v.body.blocks; track b.id) { <span class="block">{{ b.id }}: {{ b.name }}{{ b.name === kindLabels[b.kind] ? "" : " (" + kindLabels[b.kind] + ")" }}</span> }</dd></div>
          <div><dt>Pattern</dt><dd>{{ v.body.pattern.join(' ') }}</dd></div>
          <div><dt>Pieces</dt><dd>{{ v.derived.totals.pieces }} to cut for {{ v.derived.totals.blocks }} blocks</dd></div>
          <div><dt>Cut plan</dt><dd>{{ v.plan.totals.piecesPlaced }} of {{ v.plan.totals.piecesRequested }} pieces placed; garment yield {{ v.plan.totals.garmentYield | percent: '1.0-0' }}</dd></div>
        </dl>
      </div>
    </section>
  `,
  styles: `
    .version { border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; padding: 8px 16px 16px; margin-top: 12px; background: var(--mat-sys-surface-container-low); }
    .head { display: flex; align-items: center; gap: 12px; justify-content: space-between; }
    .body { display: grid; grid-template-columns: minmax(240px, 420px) 1fr; gap: 24px; align-items: start; }
    .facts { display: grid; grid-template-columns: auto 1fr; gap: 2px 12px; margin: 0; }
    .facts div { display: contents; }
    .facts dt { font-weight: 600; }
    .facts dd { margin: 0; }
    .block { display: block; }
    @media (max-width: 800px) { .body { grid-template-columns: 1fr; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignVersionView {
  readonly version = input.required<DesignVersion>();
  readonly colours = input<Record<string, string>>({});
  readonly closed = output<void>();

  protected readonly kindLabels = BLOCK_KIND_LABELS;
  protected readonly kept = computed(() => {
    const v = this.version();
    return designKeptFeatures(v);
  });
  protected readonly size = computed(() => {
    const d = this.version().derived;
    return { finished: `${both(d.finished.widthMm)} × ${both(d.finished.lengthMm)}`, target: `${both(d.target.widthMm)} × ${both(d.target.lengthMm)}` };
  });
  protected readonly preset = computed(() => {
    const t = this.version().body.target;
    if (!t.preset) return '';
    const name = MATTRESS_PRESETS.find((p) => p.id === t.preset)?.name ?? t.preset;
    return `, for a ${name} mattress${t.dropMm ? ` with a ${both(t.dropMm)} drop` : ''}`;
  });
  protected readonly layout = computed(() => {
    const l = this.version().body.layout;
    const grid = l.setting === 'straight' ? `${l.rows} rows of ${l.columns}` : `on point, ${l.rows} down and ${l.columns} across`;
    const sashing = l.sashing ? `, ${both(l.sashing.widthMm)} sashing${l.sashing.cornerstones ? ' with cornerstones' : ''}` : '';
    const borders = l.borders.length ? `, borders ${l.borders.map(both).join(', ')}` : '';
    return `${grid}, ${both(l.blockMm)} blocks${sashing}${borders}`;
  });
}
