import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-compare',
  template: '<div class="rt-page"><h1 class="rt-page-title">Compare</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Compare {}
