import type { SweepDto, SweepMapResponse } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeStation, makeWafer } from '../sweeps/sweep-test-helpers';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const upload = (waferId: number, csv: string, fields: Record<string, string>) => {
  let req = request(ctx.app).post(`/api/wafers/${waferId}/sweeps`).set(ctx.auth('engineer'));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.from(csv), 'map.csv');
};

const readMap = async (sweepId: number) => {
  const res = await request(ctx.app).get(`/api/sweeps/${sweepId}/map`).set(ctx.auth('physicist'));
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as SweepMapResponse;
};

/** Statistics by hand, independent of the product's code (sample sd, OLS slope). */
function handStatistics(sites: Array<{ r: number; v: number }>) {
  const n = sites.length;
  let sum = 0;
  for (const s of sites) sum += s.v;
  const mean = sum / n;
  let ss = 0;
  for (const s of sites) ss += (s.v - mean) * (s.v - mean);
  const sd = Math.sqrt(ss / (n - 1));
  let min = Infinity;
  let max = -Infinity;
  for (const s of sites) {
    min = Math.min(min, s.v);
    max = Math.max(max, s.v);
  }
  let rSum = 0;
  for (const s of sites) rSum += s.r;
  const rMean = rSum / n;
  let sxx = 0;
  let sxy = 0;
  for (const s of sites) {
    sxx += (s.r - rMean) * (s.r - rMean);
    sxy += (s.r - rMean) * (s.v - mean);
  }
  return {
    mean,
    sdPercent: (100 * sd) / mean,
    rangePercent: (100 * (max - min)) / (max + min),
    slopePercentPerMm: (100 * (sxy / sxx)) / mean,
  };
}

describe('a 49-site map with a known radial profile', () => {
  it('stores each site and reports uniformity as an independent computation does', async () => {
    // 150 mm wafer, 3 mm edge exclusion: usable radius 72 mm; grid-49 pitch 0.23 usable radii,
    // numbered by rows from +y, each row from -x (the documented pattern).
    const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 15 });
    const usable = 72;
    const rs = (r: number) => 50 * (1 + 0.04 * (r / usable) ** 2);
    const lines = ['site,T (K),Rs (ohm/sq)'];
    const expected: Array<{ x: number; y: number; r: number; v: number }> = [];
    let n = 0;
    for (let row = 3; row >= -3; row--) {
      for (let col = -3; col <= 3; col++) {
        n += 1;
        const x = col * 0.23 * usable;
        const y = row * 0.23 * usable;
        const r = Math.hypot(x, y);
        expected.push({ x, y, r, v: rs(r) * 0.05 });
        lines.push(`${n},296.15,${rs(r)}`);
      }
    }
    const res = await upload(wafer.id, lines.join('\n'), {
      method: 'sheet-resistance',
      sitePattern: 'grid-49',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.pointCount).toBe(49);

    const map = await readMap(res.body.id);
    expect(map.map).toMatchObject({ diameterMm: 150, edgeExclusionMm: 3, pattern: 'grid-49' });
    expect(map.outline).toBe('flat');
    expect(map.pattern?.sites).toHaveLength(49);
    expect(map.temperaturesK).toHaveLength(1);
    const [at] = map.maps;
    expect(at!.sites).toHaveLength(49);
    for (const e of expected) {
      const site = at!.sites.find(
        (s) => Math.abs(s.xMm - e.x) < 1e-9 && Math.abs(s.yMm - e.y) < 1e-9,
      );
      expect(site, `${e.x},${e.y}`).toBeDefined();
      expect(site!.resistivityOhmCm).toBeCloseTo(e.v, 10);
      expect(site!.excluded).toBe(false);
      expect(site!.edgeFactor).toBe(1);
    }
    const hand = handStatistics(expected);
    const st = at!.statistics!;
    expect(st.count).toBe(49);
    expect(st.meanOhmCm).toBeCloseTo(hand.mean, 12);
    expect(st.stdDevPercent).toBeCloseTo(hand.sdPercent, 9);
    expect(st.rangePercent).toBeCloseTo(hand.rangePercent, 9);
    expect(st.radialSlopePercentPerMm).toBeCloseTo(hand.slopePercentPerMm, 9);
    // The profile rises outward: a positive slope, and the corner sites are the maximum.
    expect(st.radialSlopePercentPerMm!).toBeGreaterThan(0);
    expect(st.maxOhmCm).toBeCloseTo(rs(Math.hypot(3, 3) * 0.23 * usable) * 0.05, 10);

    const sweep = (
      await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('engineer'))
    ).body as SweepDto;
    expect(sweep.map?.pattern).toBe('grid-49');
    expect(sweep.points[0]!.site).toEqual({ xMm: expected[0]!.x, yMm: expected[0]!.y, label: '1' });
  });
});

describe('sites near and beyond the edge', () => {
  it('corrects a four-point reading one probe spacing from the edge by the image series', async () => {
    // Probe spacing 1 mm, line pointing at the edge; the site (the probe centre) 2.5 mm from the
    // edge puts the nearest tip one spacing (1 mm) from it. Image series by hand (Valdes 1954,
    // method of images, non-conducting edge): F = 1 + [ln(4/3) - ln(7/6)] / (2 ln 2).
    const wafer = await makeWafer({ thicknessCm: 0.002, diameterCm: 10 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const imageSeries = 1 + (Math.log(4 / 3) - Math.log(7 / 6)) / (2 * Math.LN2);
    const csv = ['x (mm),y (mm),T (K),V (mV),I (mA)', '0,0,300,1.0,1', '0,47.5,300,1.0,1'].join(
      '\n',
    );
    const res = await upload(wafer.id, csv, {
      method: 'four-point',
      stationId: String(station.id),
      edgeExclusionMm: '2',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const map = await readMap(res.body.id);
    expect(map.map.correction).toBe('edge-images');
    const [centre, edge] = [...map.maps[0]!.sites].sort((a, b) => a.yMm - b.yMm);
    expect(edge!.edgeFactor).toBeCloseTo(imageSeries, 12);
    // The centre's nearest tip is 48.5 spacings from the edge: F = 1.0002, 1 to 1e-3; the edge
    // site reads F times high, so the two corrected values stand in the ratio of the factors.
    expect(centre!.edgeFactor).toBeCloseTo(1, 3);
    expect(centre!.resistivityOhmCm / edge!.resistivityOhmCm).toBeCloseTo(
      imageSeries / centre!.edgeFactor,
      12,
    );
    // 2.5 mm from the edge lies outside a 2 mm exclusion: counted.
    expect(edge!.excluded).toBe(false);
    expect(map.maps[0]!.statistics!.count).toBe(2);
  });

  it('converts a dual-configuration file by the SEMI MF1529 relation', async () => {
    // Rymaszewski 1969; SEMI MF1529: R_s = (-14.696 + 25.173 r - 7.872 r^2) R_a, r = R_a / R_b.
    const wafer = await makeWafer({ thicknessCm: 0.0005, diameterCm: 10 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const csv = ['x (mm),y (mm),T (K),R_A (ohm),R_B (ohm)', '0,0,300,10,7.9', '0,40,300,11,8.9'];
    const res = await upload(wafer.id, csv.join('\n'), {
      method: 'four-point',
      stationId: String(station.id),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const map = await readMap(res.body.id);
    expect(map.map.correction).toBe('dual-configuration');
    const relation = (ra: number, rb: number) =>
      (-14.696 + 25.173 * (ra / rb) - 7.872 * (ra / rb) ** 2) * ra;
    const [top, centre] = map.maps[0]!.sites;
    expect(centre!.sheetResistanceOhmSq).toBeCloseTo(relation(10, 7.9), 9);
    expect(top!.sheetResistanceOhmSq).toBeCloseTo(relation(11, 8.9), 9);
    // The edge factor shown is the single-configuration reading over the corrected one.
    expect(centre!.edgeFactor).toBeCloseTo(((Math.PI / Math.LN2) * 10) / relation(10, 7.9), 9);
  });

  it('stores and marks a site inside the edge exclusion, and leaves it out of the statistics', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 15 });
    const csv = [
      'x (mm),y (mm),T (K),rho (ohm cm)',
      '0,0,296,10',
      '30,0,296,12',
      '73,0,296,40',
    ].join('\n');
    const res = await upload(wafer.id, csv, { method: 'resistivity' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const map = await readMap(res.body.id);
    const edge = map.maps[0]!.sites.find((s) => s.xMm === 73)!;
    expect(edge.excluded).toBe(true);
    expect(map.maps[0]!.statistics).toMatchObject({ count: 2, meanOhmCm: 11, maxOhmCm: 12 });
    const sweep = (
      await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('engineer'))
    ).body as SweepDto;
    expect(sweep.points[2]!.flags).toContain('edge-exclusion');
    const exported = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/points.csv`)
      .set(ctx.auth('engineer'));
    const [header, , , last] = exported.text.split('\r\n');
    expect(header).toContain('flags,site_x_mm,site_y_mm,site_label');
    expect(last).toContain('edge-exclusion,73,0,');

    // The map's own export: each site, then the step's uniformity over the counted sites.
    const mapCsv = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/map.csv`)
      .set(ctx.auth('technician'));
    expect(mapCsv.status).toBe(404); // the technician has no assignment on this wafer
    const sites = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/map.csv`)
      .set(ctx.auth('physicist'));
    expect(sites.status).toBe(200);
    expect(sites.headers['content-type']).toMatch(/text\/csv/);
    const rows = sites.text
      .trim()
      .split('\r\n')
      .map((r) => r.split(','));
    const names = rows[0]!;
    const at = (row: string[], name: string) => row[names.indexOf(name)];
    expect(names.slice(0, 9)).toEqual([
      'temperature_k',
      'site',
      'x_mm',
      'y_mm',
      'sheet_resistance_ohm_sq',
      'resistivity_ohm_cm',
      'edge_factor',
      'excluded',
      'readings',
    ]);
    const siteRows = rows.slice(1, 4);
    expect(siteRows.map((r) => [at(r, 'x_mm'), at(r, 'excluded')])).toEqual([
      ['0', 'false'],
      ['30', 'false'],
      ['73', 'true'],
    ]);
    const stat = (name: string) => rows.find((r) => at(r, 'statistic') === name);
    // by hand: sites 10 and 12 ohm cm counted, 40 excluded -> mean 11, sd sqrt(2), range 9.09 %
    expect(Number(at(stat('sites counted')!, 'value'))).toBe(2);
    expect(Number(at(stat('mean')!, 'value'))).toBeCloseTo(11, 12);
    expect(Number(at(stat('standard deviation (n - 1)')!, 'value'))).toBeCloseTo(Math.SQRT2, 12);
    expect(Number(at(stat('range (max - min) / (max + min)')!, 'value'))).toBeCloseTo(
      (100 * 2) / 22,
      9,
    );
    expect(at(stat('standard deviation / mean')!, 'unit')).toBe('%');
  });

  it('refuses a site outside the wafer, naming row and column, and stores nothing', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 15 });
    const csv = ['x (mm),y (mm),T (K),rho (ohm cm)', '0,0,296,10', '60,60,296,12'].join('\n');
    const res = await upload(wafer.id, csv, { method: 'resistivity' });
    expect(res.status).toBe(422);
    const detail = res.body.error.details[0];
    expect(detail.row).toBe(3);
    expect(detail.column).toBe('x (mm)');
    expect(detail.problem).toMatch(/outside the wafer \(radius 75 mm\)/);
    const list = await request(ctx.app)
      .get(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'));
    expect(list.body).toEqual([]);
  });

  it('asks for the pattern of numbered sites and for the wafer diameter', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const csv = ['site,T (K),rho (ohm cm)', '1,296,10'].join('\n');
    const res = await upload(wafer.id, csv, { method: 'resistivity' });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([expect.objectContaining({ field: 'diameterCm' })]);
    const noPattern = await upload(wafer.id, csv, { method: 'resistivity', diameterCm: '10' });
    expect(noPattern.status).toBe(400);
    expect(noPattern.body.error.details[0].field).toBe('sitePattern');
    const tooFar = await upload(wafer.id, ['site,T (K),rho (ohm cm)', '6,296,10'].join('\n'), {
      method: 'resistivity',
      diameterCm: '10',
      sitePattern: 'centre-5',
    });
    expect(tooFar.status).toBe(422);
    expect(tooFar.body.error.details[0].problem).toMatch(/not in pattern centre-5/);
  });

  it('answers 404 for the map of a sweep without sites', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await upload(wafer.id, ['T (K),rho (ohm cm)', '296,10'].join('\n'), {
      method: 'resistivity',
    });
    expect(res.status).toBe(201);
    const map = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/map`)
      .set(ctx.auth('engineer'));
    expect(map.status).toBe(404);
  });
});
