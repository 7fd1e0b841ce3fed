import { describe, expect, it } from 'vitest';
import { type RecordNames, readableChanges, referencedIds } from './readable-change';

const names: RecordNames = {
  wafer: new Map([[14, 'W03 of lot L-7']]),
  lot: new Map([[7, 'L-7']]),
  station: new Map(),
  user: new Map([
    [2, 'Tom Tech'],
    [3, 'Tia Tech'],
  ]),
  sweep: new Map(),
};

describe('an audit change in words', () => {
  it('gives every stored length in the unit its form takes, and days as YYYY-MM-DD', () => {
    // 1 cm = 10 mm = 10⁴ µm (SI prefixes).
    const changes = readableChanges(
      { thicknessToleranceCm: 0.002, tipRadiusCm: 0.004, receivedOn: null },
      { thicknessToleranceCm: 0.0025, tipRadiusCm: 0.005, receivedOn: '2026-12-05T00:00:00.000Z' },
      names,
    );
    expect(changes.map((c) => [c.label, c.before, c.after])).toEqual([
      ['Thickness tolerance', '20 µm', '25 µm'],
      ['Probe tip radius', '40 µm', '50 µm'],
      ['Received on', '—', '2026-12-05'],
    ]);
  });

  it('names fields in words, shows units a lab uses and ids as the records’ names', () => {
    const changes = readableChanges(
      {
        id: 5,
        waferId: 14,
        assigneeId: 2,
        thicknessCm: 0.0525,
        dueDate: '2026-12-01',
        active: true,
      },
      {
        id: 5,
        waferId: 14,
        assigneeId: 3,
        thicknessCm: 0.038,
        dueDate: '2026-12-08',
        active: false,
      },
      names,
    );
    expect(changes).toEqual([
      { field: 'assigneeId', label: 'Assignee', before: 'Tom Tech', after: 'Tia Tech' },
      { field: 'thicknessCm', label: 'Thickness', before: '525 µm', after: '380 µm' },
      { field: 'dueDate', label: 'Due date', before: '2026-12-01', after: '2026-12-08' },
      { field: 'active', label: 'Active', before: 'yes', after: 'no' },
    ]);
  });

  it('lists every field of a creation with nothing before, and hides bookkeeping', () => {
    const changes = readableChanges(
      null,
      { id: 9, lotId: 7, number: 'W01', createdAt: '2026-12-05T06:00:00.000Z', specMaxOhmCm: 13 },
      names,
    );
    expect(changes).toEqual([
      { field: 'lotId', label: 'Lot', before: null, after: 'L-7' },
      { field: 'number', label: 'Number', before: null, after: 'W01' },
      { field: 'specMaxOhmCm', label: 'Spec maximum', before: null, after: '13 Ω·cm' },
    ]);
  });

  it('words an unknown field and says when a named record is gone', () => {
    const [unknown, gone] = readableChanges(
      { probeLoadGrams: 80, stationId: 99 },
      { probeLoadGrams: 100, stationId: null },
      names,
    );
    expect(unknown).toEqual({
      field: 'probeLoadGrams',
      label: 'Probe load grams',
      before: '80',
      after: '100',
    });
    expect(gone!.before).toBe('station 99 (no longer on record)');
    expect(gone!.after).toBe('—');
  });

  it('words nested records (geometry, parameters) instead of showing their stored keys', () => {
    const [geometry] = readableChanges(
      null,
      { geometry: { thicknessCm: 0.05, spacingCm: 0.1, sources: { thicknessCm: 'lot' } } },
      names,
    );
    expect(geometry!.after).toBe('thickness 500 µm, probe spacing 1 mm, sources thickness lot');
    const [free] = readableChanges(null, { free: ['donorDensity', 'donorLevel'] }, names);
    expect(free!.after).toBe('donor density, donor level');
    const [parameters] = readableChanges(null, { parameters: { donorDensity: 1e15 } }, names);
    expect(parameters!.after).toBe('donor density 1.000 × 10^15');
    expect(JSON.stringify([geometry, parameters])).not.toMatch(/Cm"|donorDensity\b.*:/);
  });

  it('collects the ids to name, by kind', () => {
    const ids = referencedIds([{ waferId: 14, assigneeId: 2 }, { assignedById: 3 }, null]);
    expect([...ids.wafer]).toEqual([14]);
    expect([...ids.user].sort()).toEqual([2, 3]);
  });
});
