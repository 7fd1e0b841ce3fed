import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-station-list',
  template: '<div class="rt-page"><h1 class="rt-page-title">StationList</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationList {}
