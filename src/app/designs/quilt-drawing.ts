import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { DesignBody, DesignDerivation, designDrawing } from '@keepstitch/shared';

/** The quilt top drawn to scale as SVG, each shape in the colour of its fabric. */
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

  protected colourOf(key: string): string {
    return this.colours()[key] ?? 'url(#ks-any-fabric)';
  }
}
