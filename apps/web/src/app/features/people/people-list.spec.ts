import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import type {
  AssignmentDto,
  CreateUserRequest,
  Role,
  UpdateUserRequest,
  UserDto,
} from '@rhotrace/api-types';
import { Session } from '../../core/auth/session';
import { of, throwError } from 'rxjs';
import { ApiError } from '../../core/http/api-error';
import { PeopleApi } from './people-api';
import { PeopleList } from './people-list';

class FakePeopleApi {
  readonly created: CreateUserRequest[] = [];
  lists = 0;
  refuse: ApiError | null = null;
  list() {
    this.lists += 1;
    return of({ items: this.people, total: this.people.length, page: 1, pageSize: 200 });
  }
  create(body: CreateUserRequest) {
    this.created.push(body);
    return this.refuse ? throwError(() => this.refuse) : of({ id: 9, ...body });
  }
  readonly updates: Array<{ id: number; body: UpdateUserRequest }> = [];
  people: UserDto[] = [];
  update(id: number, body: UpdateUserRequest) {
    this.updates.push({ id, body });
    return of(null);
  }
  openTasks() {
    return of([
      task(31, 'W07', '2020-01-01', true),
      task(32, 'W08', '2030-01-01', false),
    ] as AssignmentDto[]);
  }
  assignees() {
    return of([
      { id: 1, name: 'Ada Admin', email: 'ada@lab.example', role: 'admin' },
      { id: 2, name: 'Tom Tech', email: 'tom@lab.example', role: 'technician' },
      { id: 3, name: 'Tia Tech', email: 'tia@lab.example', role: 'technician' },
    ]);
  }
}

const task = (id: number, waferNumber: string, dueDate: string, overdue: boolean) => ({
  id,
  waferId: id,
  waferNumber,
  lotCode: 'L-1',
  task: 'Measure rho(T)',
  dueDate,
  overdue,
  state: 'assigned',
});

const person = (id: number, name: string, role: Role): UserDto =>
  ({ id, name, email: `${id}@lab.example`, role, active: true }) as UserDto;

async function setup(people: UserDto[] = []) {
  const api = new FakePeopleApi();
  api.people = people;
  TestBed.configureTestingModule({
    imports: [PeopleList],
    providers: [
      { provide: PeopleApi, useValue: api },
      { provide: Session, useValue: { user: () => ({ id: 1, name: 'Ada Admin' }) } },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
    ],
  });
  const fixture = TestBed.createComponent(PeopleList);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = (name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
  const button = (text: string) => loader.getHarness(MatButtonHarness.with({ text }));
  const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  return { api, loader, root, input, button, fixture };
}

describe('PeopleList', () => {
  it('keeps an incomplete account in the form and says which field is missing', async () => {
    const { api, loader, button } = await setup();
    await (await button('Add a person')).click();
    await (await button('Create the account')).click();
    expect(api.created).toEqual([]);
    const name = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Name' }));
    expect(await name.getTextErrors()).toEqual(['This is needed.']);
  });

  it('creates the account and closes the form; a taken e-mail is marked on its field', async () => {
    const { api, loader, input, button } = await setup();
    await (await button('Add a person')).click();
    await (await input('name')).setValue('Bea Example');
    await (await input('email')).setValue('bea@lab.example');
    await (await input('password')).setValue('a long enough secret');
    api.refuse = new ApiError(409, 'conflict', 'That e-mail already has an account');
    await (await button('Create the account')).click();
    const email = await loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }),
    );
    expect(await email.getTextErrors()).toEqual(['The server says this already has an account.']);

    api.refuse = null;
    await (await input('email')).setValue('bea2@lab.example');
    await (await button('Create the account')).click();
    expect(api.created.at(-1)).toEqual({
      name: 'Bea Example',
      email: 'bea2@lab.example',
      role: 'technician',
      password: 'a long enough secret',
    });
    expect(api.lists).toBe(2);
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Create the account' })),
    ).toHaveLength(0);
  });

  it("never offers to deactivate one's own account", async () => {
    const { loader, fixture } = await setup([person(1, 'Ada Admin', 'admin')]);
    const own = await loader.getHarness(MatSlideToggleHarness);
    expect(await own.isDisabled()).toBe(true);
    expect(fixture.nativeElement.textContent).toContain('your own account');
  });

  it('asks before deactivating, names the open tasks and hands them over in one request', async () => {
    const { api, loader, root, fixture } = await setup([
      person(1, 'Ada Admin', 'admin'),
      person(2, 'Tom Tech', 'technician'),
    ]);
    const toggles = await loader.getAllHarnesses(MatSlideToggleHarness);
    await toggles[1]!.toggle();
    const dialog = await root.getHarness(MatDialogHarness);
    const text = await dialog.getText();
    expect(text).toContain('Deactivate Tom Tech?');
    expect(text).toContain('2 open tasks');
    expect(text).toContain('Wafer W07 of lot L-1: Measure rho(T), due 2020-01-01 (overdue)');
    expect(api.updates).toEqual([]);
    // Another technician is offered first.
    await (await root.getHarness(MatButtonHarness.with({ text: 'Deactivate Tom Tech' }))).click();
    await fixture.whenStable();
    expect(api.updates).toEqual([{ id: 2, body: { active: false, reassignTo: 3 } }]);
  });

  it('puts the switch back and changes nothing when the question is declined', async () => {
    const { api, loader, root, fixture } = await setup([
      person(1, 'Ada Admin', 'admin'),
      person(2, 'Tom Tech', 'technician'),
    ]);
    const toggles = await loader.getAllHarnesses(MatSlideToggleHarness);
    await toggles[1]!.toggle();
    await (await root.getHarness(MatButtonHarness.with({ text: 'Keep the account' }))).click();
    await fixture.whenStable();
    expect(api.updates).toEqual([]);
    expect(await toggles[1]!.isChecked()).toBe(true);
  });
});
