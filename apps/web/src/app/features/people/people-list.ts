import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-people-list',
  template: '<div class="rt-page"><h1 class="rt-page-title">PeopleList</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleList {}
