import type { ImportSettingsDto, SweepPreviewResponse } from '@rhotrace/api-types';
import { newUploadItem, presetFrom, settingsOf, type UploadItem } from './upload-item';

const shape = 'b'.repeat(64);

function itemWith(choices: Partial<UploadItem['choices']>): UploadItem {
  const item = newUploadItem(1, new File(['x'], 'w01.csv'));
  return {
    ...item,
    preview: { shape, shapeLabel: '4 comma-separated columns' } as SweepPreviewResponse,
    choices: { ...item.choices, stationId: 3, ...choices },
  };
}

const saved: ImportSettingsDto = {
  id: 9,
  stationId: 3,
  stationName: 'Magnet bench',
  shape,
  shapeLabel: '4 comma-separated columns',
  method: 'hall',
  columns: [],
  geometry: { thicknessCm: 0.05 },
  layout: {},
  savedById: 2,
  savedByName: 'Demo Engineer',
  updatedAt: '2026-12-01T09:00:00.000Z',
  hallFactor: 'acoustic-phonon',
  map: null,
};

describe('saved import settings of a file', () => {
  it("save a Hall file's factor, and only for the hall method", () => {
    expect(settingsOf(itemWith({ method: 'hall', hallFactor: 1.18 }))).toMatchObject({
      method: 'hall',
      hallFactor: 1.18,
    });
    expect(settingsOf(itemWith({ method: 'four-point', hallFactor: 1.18 }))).not.toHaveProperty(
      'hallFactor',
    );
  });

  it("save a map's site pattern and edge exclusion", () => {
    const map = { sitePattern: 'ring-25', edgeExclusionMm: 5 };
    expect(settingsOf(itemWith({ method: 'four-point', map }))).toMatchObject({ map });
    expect(settingsOf(itemWith({ method: 'four-point' }))).not.toHaveProperty('map');
  });

  it('preset the next file with the saved factor and map fields', () => {
    const hall = presetFrom(itemWith({}), saved, []);
    expect(hall.choices).toMatchObject({ method: 'hall', hallFactor: 'acoustic-phonon' });
    const map = { sitePattern: 'grid-49', edgeExclusionMm: 2 };
    const mapped = presetFrom(
      itemWith({}),
      { ...saved, method: 'four-point', hallFactor: null, map },
      [],
    );
    expect(mapped.choices).toMatchObject({ method: 'four-point', map });
    expect(mapped.choices?.hallFactor).toBeUndefined();
  });
});
