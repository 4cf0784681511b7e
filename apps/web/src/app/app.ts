import { ChangeDetectionStrategy, Component } from '@angular/core';
import { Shell } from './shell/shell';

@Component({
  selector: 'sw-root',
  imports: [Shell],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<sw-shell />`,
  styles: `
    :host {
      display: block;
      min-height: 100%;
    }
  `,
})
export class App {}
