import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-change-trail',
  template: '<div class="rt-page"><h1 class="rt-page-title">ChangeTrail</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeTrail {}
