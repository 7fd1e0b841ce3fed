import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-home',
  template: '<div class="rt-page"><h1 class="rt-page-title">Bench</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {}
