import { describe, expect, it } from 'vitest';
import { edgeCorrectionFactor } from './edge-correction';

/**
 * An independent image-series evaluation: point sources in the plane with 2-D coordinates, each
 * mirrored in the edge line (a non-conducting edge mirrors a source with the same sign; Valdes
 * 1954, Proc. IRE 42, 420), the potential of a source -q ln r. The probe line is placed at an
 * arbitrary angle to the axes so that no shortcut of the implementation is reused.
 */
function imageSeriesFactor(distance: number, spacing: number, parallel: boolean): number {
  const theta = 0.7; // rotation of the whole set-up
  const edgeNormal = [Math.cos(theta), Math.sin(theta)] as const; // points into the sheet
  const along = parallel ? [-edgeNormal[1], edgeNormal[0]] : edgeNormal;
  const start = [distance * edgeNormal[0], distance * edgeNormal[1]]; // edge through the origin
  const probe = (k: number) => [
    start[0]! + k * spacing * along[0]!,
    start[1]! + k * spacing * along[1]!,
  ];
  const mirror = ([x, y]: number[]) => {
    const dot = x! * edgeNormal[0] + y! * edgeNormal[1];
    return [x! - 2 * dot * edgeNormal[0], y! - 2 * dot * edgeNormal[1]];
  };
  const sources = [
    { at: probe(0), q: 1 },
    { at: probe(3), q: -1 },
  ];
  const potential = (p: number[], withImages: boolean) =>
    sources.reduce((sum, s) => {
      const direct = -s.q * Math.log(Math.hypot(p[0]! - s.at[0]!, p[1]! - s.at[1]!));
      if (!withImages) return sum + direct;
      const m = mirror(s.at);
      return sum + direct - s.q * Math.log(Math.hypot(p[0]! - m[0]!, p[1]! - m[1]!));
    }, 0);
  const v = (withImages: boolean) =>
    potential(probe(1), withImages) - potential(probe(2), withImages);
  return v(true) / v(false);
}

describe('edgeCorrectionFactor', () => {
  it('matches the image series one probe spacing from the edge', () => {
    // Independent evaluation above (method of images, Valdes 1954); 1.0963 by hand:
    // 1 + [ln(4/3) - ln(7/6)] / (2 ln 2) = 1 + 0.13353 / 1.38629 = 1.09632.
    const f = edgeCorrectionFactor({ distanceCm: 0.1, spacingCm: 0.1 });
    expect(f).toBeCloseTo(imageSeriesFactor(0.1, 0.1, false), 12);
    expect(f).toBeCloseTo(1 + (Math.log(4 / 3) - Math.log(7 / 6)) / (2 * Math.LN2), 12);
  });

  it('agrees with the image series at any distance, in both orientations', () => {
    for (const d of [0, 0.013, 0.05, 0.2, 1.7]) {
      for (const parallel of [false, true]) {
        const orientation = parallel ? 'parallel' : 'perpendicular';
        expect(edgeCorrectionFactor({ distanceCm: d, spacingCm: 0.1, orientation })).toBeCloseTo(
          imageSeriesFactor(d, 0.1, parallel),
          10,
        );
      }
    }
  });

  it('is 1 far from the edge and 2 for a probe line on the edge', () => {
    // Limits of the method of images (Valdes 1954): no image contributes far away; a line lying
    // on the edge sees each image on its source, doubling the voltage.
    expect(edgeCorrectionFactor({ distanceCm: 1000, spacingCm: 0.1 })).toBeCloseTo(1, 6);
    expect(
      edgeCorrectionFactor({ distanceCm: 0, spacingCm: 0.1, orientation: 'parallel' }),
    ).toBeCloseTo(2, 12);
    // Pointing at the edge, the outer probe touching it: 1 + [ln 2 - ln(5/4)] / (2 ln 2).
    expect(edgeCorrectionFactor({ distanceCm: 0, spacingCm: 0.1 })).toBeCloseTo(
      1 + (Math.LN2 - Math.log(5 / 4)) / (2 * Math.LN2),
      12,
    );
  });

  it('falls as the probe moves away from the edge', () => {
    const f = [0, 0.05, 0.1, 0.3].map((d) =>
      edgeCorrectionFactor({ distanceCm: d, spacingCm: 0.1 }),
    );
    expect(f[0]).toBeGreaterThan(f[1]!);
    expect(f[1]).toBeGreaterThan(f[2]!);
    expect(f[2]).toBeGreaterThan(f[3]!);
  });

  it('refuses a negative distance, a zero spacing and an unknown orientation', () => {
    expect(() => edgeCorrectionFactor({ distanceCm: -0.1, spacingCm: 0.1 })).toThrow(
      /`edgeCorrectionFactor`.*distanceCm/,
    );
    expect(() => edgeCorrectionFactor({ distanceCm: 0.1, spacingCm: 0 })).toThrow(/spacingCm/);
    expect(() =>
      edgeCorrectionFactor({
        distanceCm: 0.1,
        spacingCm: 0.1,
        orientation: 'diagonal' as 'parallel',
      }),
    ).toThrow(/orientation/);
  });
});
