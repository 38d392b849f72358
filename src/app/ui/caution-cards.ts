import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

export interface CautionView {
  code: string;
  title: string;
  text: string;
  source: string;
}

/** The safety notices a commission carries, each as a card with its source. */
@Component({
  selector: 'ks-caution-cards',
  imports: [MatCardModule, MatIconModule],
  template: `
    @for (caution of cautions(); track caution.code) {
      <mat-card appearance="outlined" class="caution" role="note" [attr.data-testid]="'caution-' + caution.code">
        <mat-card-header>
          <mat-icon mat-card-avatar aria-hidden="true">health_and_safety</mat-icon>
          <mat-card-title>{{ caution.title }}</mat-card-title>
        </mat-card-header>
        <mat-card-content>
          <p>{{ caution.text }}</p>
          <p class="source">Source: {{ caution.source }}</p>
        </mat-card-content>
      </mat-card>
    }
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 0.5rem;
    }
    .caution {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .source {
      font: var(--mat-sys-body-small);
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CautionCards {
  readonly cautions = input<readonly CautionView[]>([]);
}
