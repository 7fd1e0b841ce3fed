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
      flaggedReadings: [{ sequence: 15, temperatureK: 330, resistivityOhmCm: 2.1 }],
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

  it('lists only the studied leg’s doubtful points and counts those of the other legs', async () => {
    const api = withLegs();
    // leg 2 studied: its flagged readings are none; point 15 of leg 1 is counted, not listed
    api.analysisAnswer = { ...api.analysisAnswer, leg: 2, flaggedReadings: [] };
    const { fixture } = await mountPart(SweepFaults, api);
    const text = ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
    expect(text).toContain('Doubtful points of leg 2');
    expect(text).toContain('None in this leg.');
    expect(text).toContain('1 more point lies in the other legs');
    expect(text).not.toContain('Point 15 (row 16)');
  });

  it('asks the analysis for the leg picked', async () => {
    const api = withLegs();
    const { loader } = await mountPart(SweepFaults, api);
    const all = await loader.getHarness(MatButtonToggleHarness.with({ text: 'All legs' }));
    await all.check();
    expect(api.legsAsked.at(-1)).toBe('all');
  });
});
