import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { FakeAnalysisApi, analysisOf, mountPart } from '../../testing/study-fakes';
import { SweepFaults } from './sweep-faults';

describe('SweepFaults', () => {
  function withLegs() {
    const api = new FakeAnalysisApi();
    api.analysisAnswer = {
      ...analysisOf(),
      legs: [
        { index: 1, direction: 'up', minK: 250, maxK: 400, stepCount: 31 },
        { index: 2, direction: 'down', minK: 250, maxK: 395, stepCount: 30 },
      ],
      leg: 1,
      thermalLag: { lagK: 1.02, standardErrorK: 0.05 },
      flaggedPoints: 1,
      findings: [
        {
          sequence: 15,
          row: 16,
          flag: 'outlier',
          reason: 'ln rho lies 9.1 scaled MAD off the trend of its neighbours (+27.8 %) in leg 1',
        },
      ],
    };
    return api;
  }

  it('lists the legs, the thermal lag and each doubtful point with its reason', async () => {
    const { fixture } = await mountPart(SweepFaults, withLegs());
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Leg 1 ↑ 250–400 K, 31 steps');
    expect(text).toContain('Thermal lag 1.02 ± 0.05 K');
    expect(text).toContain('Point 15 (row 16), Outlier:');
    expect(text).toContain('(+27.8 %) in leg 1');
  });

  it("shows the import's warnings, such as a van der Pauw R_A/R_B above 3", async () => {
    const api = withLegs();
    const ratio = 'R_A/R_B reaches 4.05 (above 3) at 5 point(s): check the contacts';
    api.analysisAnswer = { ...api.analysisAnswer, importWarnings: [ratio] };
    const { fixture } = await mountPart(SweepFaults, api);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(ratio);
  });

  it('asks the analysis for the leg picked', async () => {
    const api = withLegs();
    const { loader } = await mountPart(SweepFaults, api);
    const all = await loader.getHarness(MatButtonToggleHarness.with({ text: 'All legs' }));
    await all.check();
    expect(api.legsAsked.at(-1)).toBe('all');
  });
});
