import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { DesignBody, DesignDerivation, KeptFeaturePlace, UNKNOWN_FABRIC_COLOUR, designDrawing, fabricKey, garmentGroups, keptFeatureLabel, keptFeatureOutline } from '@keepstitch/shared';

import { groupColours } from './design';

const points = (pts: readonly [number, number][]) => pts.map(([x, y]) => `${x.toFixed(2)},${y.toFixed(2)}`).join(' ');

let drawings = 0;

/**
 * The quilt top drawn to scale as SVG, each shape in the colour of its fabric,
 * a group of garments in stripes of theirs; a block piece cut around a kept
 * feature carries a dashed outline and a dot, named in a key below.
 */
@Component({
  selector: 'ks-quilt-drawing',
  template: `
    @if (drawing(); as d) {
      <svg
        data-testid="quilt-drawing"
        [attr.viewBox]="'0 0 ' + d.width + ' ' + d.height"
        [attr.aria-label]="label()"
        role="img"
        xmlns="http://www.w3.org/2000/svg"
      >
        <defs>
          <pattern id="ks-any-fabric" width="40" height="40" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="40" height="40" fill="#f1efe8" />
            <rect width="14" height="40" fill="#d8d3c4" />
          </pattern>
          @for (g of groupPatterns(); track g.id) {
            <pattern [attr.id]="g.id" [attr.width]="g.stripes.length * 30" height="30" patternUnits="userSpaceOnUse" patternTransform="rotate(45)" [attr.data-group]="g.key">
              @for (c of g.stripes; track $index) {
                <rect [attr.x]="$index * 30" width="30" height="30" [attr.fill]="c" />
              }
            </pattern>
          }
        </defs>
        @for (s of d.shapes; track $index) {
          <polygon
            [attr.points]="s.points"
            [attr.fill]="colourOf(s.fill)"
            [attr.data-position]="s.position ?? null"
            [attr.data-fill]="s.fill"
            stroke="#3b3b3b"
            [attr.stroke-width]="stroke()"
            (click)="s.position !== undefined && positionPicked.emit(s.position)"
          >
            <title>{{ s.part }}</title>
          </polygon>
        }
        @for (m of marks(); track $index) {
          <g class="kept" data-testid="kept-mark" [attr.data-kept-position]="m.position" [attr.aria-label]="m.label">
            <title>{{ m.label }}</title>
            <polygon [attr.points]="m.points" fill="none" stroke="#fff" [attr.stroke-width]="stroke() * 5" />
            <polygon [attr.points]="m.points" fill="none" stroke="#000" [attr.stroke-width]="stroke() * 2.5" [attr.stroke-dasharray]="stroke() * 6 + ' ' + stroke() * 4" />
            <circle [attr.cx]="m.cx" [attr.cy]="m.cy" [attr.r]="m.r" fill="#000" stroke="#fff" [attr.stroke-width]="stroke() * 2" />
          </g>
        }
      </svg>
      @if (legend() && marks().length) {
        <div class="kept-key" data-testid="kept-legend">
          <p>
            <svg class="symbol" viewBox="0 0 16 16" aria-hidden="true"><rect x="1.5" y="1.5" width="13" height="13" fill="#e6e6e6" stroke="#000" stroke-width="1.5" stroke-dasharray="3 2" /><circle cx="8" cy="8" r="2.5" fill="#000" stroke="#fff" stroke-width="1" /></svg>
            Dashed outline and dot: a block piece cut around a feature kept whole, with the feature centred.
          </p>
          <ul>
            @for (m of marks(); track $index) {
              <li>{{ m.label }}.</li>
            }
          </ul>
        </div>
      }
    }
  `,
  styles: `
    :host { display: block; }
    svg[data-testid='quilt-drawing'] { width: 100%; height: auto; max-height: 70vh; display: block; background: #fff; }
    polygon { cursor: pointer; }
    .kept polygon { cursor: default; pointer-events: none; }
    .kept-key { font-size: 0.9em; margin-top: 6px; }
    .kept-key p { display: flex; gap: 6px; align-items: center; margin: 0; }
    .kept-key ul { margin: 2px 0 0; padding-left: 28px; }
    .symbol { width: 16px; height: 16px; flex: none; }
    @media print { .kept-key { color: #000; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuiltDrawing {
  readonly body = input.required<DesignBody>();
  readonly derived = input.required<DesignDerivation>();
  /** Drawing colours by fabric key. */
  readonly colours = input<Readonly<Record<string, string>>>({});
  /** Where the plan keeps features whole. */
  readonly kept = input<readonly KeptFeaturePlace[]>([]);
  /** Whether to name the kept features below the drawing (a printout keys them itself). */
  readonly legend = input(true);
  readonly positionPicked = output<number>();

  /** Pattern ids are the page's: each drawing has its own, so two drawings of different versions never share stripes. */
  private readonly uid = ++drawings;

  protected readonly drawing = computed(() => {
    const d = designDrawing(this.body(), this.derived());
    return { ...d, shapes: d.shapes.map((s) => ({ ...s, points: points(s.points) })) };
  });
  protected readonly stroke = computed(() => Math.max(1, this.drawing().width / 600));
  protected readonly marks = computed(() =>
    this.kept().flatMap((k) => {
      const outline = keptFeatureOutline(this.body(), this.derived(), k);
      if (!outline) return [];
      const xs = outline.map((p) => p[0]);
      const ys = outline.map((p) => p[1]);
      const side = Math.min(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
      return [{ position: k.position, label: keptFeatureLabel(k), points: points(outline), cx: xs.reduce((a, b) => a + b) / xs.length, cy: ys.reduce((a, b) => a + b) / ys.length, r: Math.max(this.stroke() * 3, side / 14) }];
    }),
  );
  protected readonly label = computed(() => [`Drawing of the quilt top, ${this.derived().positions.length} blocks`, ...this.marks().map((m) => m.label)].join('; '));

  /** One stripe pattern for each group of garments the drawing fills with. */
  protected readonly groupPatterns = computed(() => {
    const keys = new Set(this.drawing().shapes.map((s) => s.fill).filter((f) => f.startsWith('group:')));
    const groups = garmentGroups(this.body());
    return [...keys].map((key) => {
      const group = groups.find((g) => fabricKey({ kind: 'group', groupId: g.id }) === key);
      const stripes = group ? groupColours(group, this.colours()) : [];
      return { key, id: this.patternId(key), stripes: stripes.length ? stripes : [UNKNOWN_FABRIC_COLOUR] };
    });
  });

  private patternId(key: string): string {
    return `ks-${key.replace(/[^0-9a-z]+/g, '-')}-${this.uid}`;
  }

  protected colourOf(key: string): string {
    if (key.startsWith('group:')) return `url(#${this.patternId(key)})`;
    return this.colours()[key] ?? 'url(#ks-any-fabric)';
  }
}
