import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { CreateUserRequest, UserDto } from '@rhotrace/api-types';
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
    return of({ items: [] as UserDto[], total: 0, page: 1, pageSize: 200 });
  }
  create(body: CreateUserRequest) {
    this.created.push(body);
    return this.refuse ? throwError(() => this.refuse) : of({ id: 9, ...body });
  }
  update() {
    return of(null);
  }
}

async function setup() {
  const api = new FakePeopleApi();
  TestBed.configureTestingModule({
    imports: [PeopleList],
    providers: [{ provide: PeopleApi, useValue: api }],
  });
  const fixture = TestBed.createComponent(PeopleList);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = (name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
  const button = (text: string) => loader.getHarness(MatButtonHarness.with({ text }));
  return { api, loader, input, button, fixture };
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
});
