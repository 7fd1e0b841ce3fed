import { analysisUrl, openingAnalysisUrl } from './analysis-urls';

describe('analysis addresses', () => {
  it('names a leg only when one is chosen', () => {
    expect(analysisUrl(7)).toBe('/api/sweeps/7/analysis');
    expect(analysisUrl(7, 2)).toBe('/api/sweeps/7/analysis?leg=2');
    expect(analysisUrl(7, 'all')).toBe('/api/sweeps/7/analysis?leg=all');
  });

  it('knows the study page’s first request from its path, and nothing else', () => {
    expect(openingAnalysisUrl('/sweeps/7')).toBe('/api/sweeps/7/analysis');
    expect(openingAnalysisUrl('/sweeps/7/')).toBe('/api/sweeps/7/analysis');
    expect(openingAnalysisUrl('/sweeps/x')).toBeNull();
    expect(openingAnalysisUrl('/wafers/7')).toBeNull();
    expect(openingAnalysisUrl('/sweeps/7/fits')).toBeNull();
  });
});
