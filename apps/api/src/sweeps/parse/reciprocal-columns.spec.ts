import { describe, expect, it } from 'vitest';
import { guessColumns } from './columns';

// Van der Pauw 1958 names a reading R_AB,CD (current A to B, voltage across C, D); its reciprocal
// swaps the pairs, R_CD,AB. Files spell them with letters, contact numbers or a suffix.
describe('reciprocal van der Pauw columns', () => {
  const meanings = (headers: string[]) =>
    guessColumns(headers, null, headers.length).map((c) => `${c.meaning}:${c.unit}`);

  it.each([
    [['T (K)', 'R_AB,CD (ohm)', 'R_CD,AB (ohm)', 'R_BC,DA (ohm)', 'R_DA,BC (ohm)']],
    [['T (K)', 'R_1234 (ohm)', 'R_3412 (ohm)', 'R_2341 (ohm)', 'R_4123 (ohm)']],
    [['T (K)', 'R_A (ohm)', 'R_A rec (ohm)', 'R_B (ohm)', 'R_B reciprocal (ohm)']],
  ])('reads %j as both configurations and their reciprocals', (headers) => {
    expect(meanings(headers)).toEqual([
      'temperature:K',
      'resistance:ohm',
      'resistance-reciprocal:ohm',
      'resistance-b:ohm',
      'resistance-b-reciprocal:ohm',
    ]);
  });

  it('leaves a file without reciprocals as it was', () => {
    expect(meanings(['T (K)', 'R_A (ohm)', 'R_B (ohm)'])).toEqual([
      'temperature:K',
      'resistance:ohm',
      'resistance-b:ohm',
    ]);
  });
});
