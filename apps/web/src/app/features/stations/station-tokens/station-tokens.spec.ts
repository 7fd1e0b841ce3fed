import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { StationDto, StationTokenDto } from '@rhotrace/api-types';
import { of } from 'rxjs';
import { StationsApi } from '../stations-api';
import { StationTokens } from './station-tokens';

const BENCH = { id: 4, name: 'Cold bench' } as StationDto;
const SECRET = 'rts_0123456789abcdefghijklmnopqrstuvwxyzABCDEFG';

/** A StationsApi keeping tokens in memory, as the API would (the secret only in the answer). */
class FakeStationsApi {
  readonly tokenList: StationTokenDto[] = [];
  readonly revoked: number[] = [];
  tokens() {
    return of([...this.tokenList]);
  }
  createToken(stationId: number, label: string) {
    const id = this.tokenList.length + 1;
    const createdAt = '2026-02-01T10:00:00.000Z';
    this.tokenList.unshift({
      id,
      stationId,
      label,
      prefix: SECRET.slice(0, 12),
      createdAt,
      createdBy: { id: 1, name: 'Ada Manager' },
      lastUsedAt: null,
      revokedAt: null,
    });
    return of({ id, label, prefix: SECRET.slice(0, 12), token: SECRET, createdAt });
  }
  revokeToken(_stationId: number, tokenId: number) {
    this.revoked.push(tokenId);
    return of(null);
  }
}

async function setup() {
  const api = new FakeStationsApi();
  TestBed.configureTestingModule({
    imports: [StationTokens],
    providers: [
      { provide: StationsApi, useValue: api },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
    ],
  });
  const fixture = TestBed.createComponent(StationTokens);
  fixture.componentRef.setInput('stations', [BENCH]);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
  return { fixture, api, loader, root, text };
}

describe('StationTokens', () => {
  it('shows a new token once, lists it by its prefix, and revokes only when confirmed', async () => {
    const { api, loader, root, text, fixture } = await setup();
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Cold bench' });
    const label = await loader.getHarness(
      MatInputHarness.with({ placeholder: 'cryostat PC, bench 2' }),
    );
    await label.setValue('bench PC');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'New token' }))).click();
    await fixture.whenStable();
    expect(text()).toContain(SECRET);
    expect(text()).toContain('cannot show it again');
    expect(text()).not.toContain('This is needed'); // the emptied label field is not in error
    expect(text()).toContain('rts_01234567…');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'I have stored it' }))).click();
    expect(text()).not.toContain(SECRET);
    expect(text()).toContain('never'); // not used yet

    const revoke = await loader.getHarness(
      MatButtonHarness.with({ selector: '[aria-label="Revoke the token bench PC"]' }),
    );
    await revoke.click();
    let dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep it' }))).click();
    expect(api.revoked).toEqual([]);
    await revoke.click();
    dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Revoke the token' }))).click();
    expect(api.revoked).toEqual([1]);
  });
});
