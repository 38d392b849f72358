import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { DesignBody, DesignDerivation, designDrawing } from '@keepstitch/shared';

import { groupColours } from './design';

/** The quilt top drawn to scale as SVG, each shape in the colour of its fabric; a group of garments in stripes of theirs. */
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
      </svg>
    }
  `,
  styles: `
    :host { display: block; }
    svg { width: 100%; height: auto; max-height: 70vh; display: block; background: #fff; }
    polygon { cursor: pointer; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuiltDrawing {
  readonly body = input.required<DesignBody>();
  readonly derived = input.required<DesignDerivation>();
  /** Drawing colours by fabric key. */
  readonly colours = input<Readonly<Record<string, string>>>({});
  readonly positionPicked = output<number>();

  protected readonly drawing = computed(() => {
    const d = designDrawing(this.body(), this.derived());
    return { ...d, shapes: d.shapes.map((s) => ({ ...s, points: s.points.map(([x, y]) => `${x.toFixed(2)},${y.toFixed(2)}`).join(' ') })) };
  });
  protected readonly stroke = computed(() => Math.max(1, this.drawing().width / 600));
  protected readonly label = computed(() => `Drawing of the quilt top, ${this.derived().positions.length} blocks`);

  /** One stripe pattern for each group of garments the drawing fills with. */
  protected readonly groupPatterns = computed(() => {
    const keys = new Set(this.drawing().shapes.map((s) => s.fill).filter((f) => f.startsWith('group:')));
    return [...keys].map((key) => ({ key, id: `ks-${key.replace(/[^0-9a-z]+/g, '-')}`, stripes: groupColours(key, this.colours()) }));
  });

  protected colourOf(key: string): string {
    if (key.startsWith('group:')) return `url(#ks-${key.replace(/[^0-9a-z]+/g, '-')})`;
    return this.colours()[key] ?? 'url(#ks-any-fabric)';
  }
}
