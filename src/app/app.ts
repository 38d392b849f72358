import { ChangeDetectionStrategy, Component } from '@angular/core';

import { Shell } from './core/shell';

@Component({
  selector: 'ks-root',
  imports: [Shell],
  template: '<ks-shell />',
  styles: ':host { display: block; height: 100%; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {}
