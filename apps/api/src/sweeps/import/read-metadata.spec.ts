import { describe, expect, it } from 'vitest';
import { recogniseMetadata } from '../parse';
import { lengthText, readMetadata, type MetadataRecords } from './read-metadata';

const records: MetadataRecords = {
  wafer: { number: 'W03', thicknessCm: 0.0525 },
  lot: { code: 'DEMO', thicknessCm: null, diameterCm: 10 },
  station: { name: 'Hot chuck', probeSpacingCm: 0.1 },
};
const read = (lines: Record<string, string>) => readMetadata(recogniseMetadata(lines), records, {});

describe('readMetadata', () => {
  it('takes a sample named by lot and wafer, or by the wafer alone, as this wafer', () => {
    expect(read({ Sample: 'DEMO-W03' })).toEqual([]);
    expect(read({ 'Wafer ID': 'w03' })).toEqual([]);
    expect(read({ Sample: 'DEMO-W04' })[0]).toMatchObject({ key: 'sampleName', field: null });
  });

  it('ignores lengths within 1 % of the record and names the others', () => {
    expect(read({ Thickness: '525 um', Diameter: '100 mm', Spacing: '1.0 mm' })).toEqual([]);
    expect(read({ Thickness: '528 um' })).toEqual([]);
    expect(read({ Diameter: '150 mm' })[0]).toMatchObject({
      agreement: 'disagrees',
      fileText: '150 mm',
      recordText: '100 mm on the lot',
    });
  });

  it('writes lengths in µm below 1 mm and in mm above', () => {
    expect(lengthText(0.038)).toBe('380 µm');
    expect(lengthText(0.1)).toBe('1 mm');
    expect(lengthText(15)).toBe('150 mm');
  });
});
