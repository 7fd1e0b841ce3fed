import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-worklist',
  template: '<div class="rt-page"><h1 class="rt-page-title">Worklist</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Worklist {}
