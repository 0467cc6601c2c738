import { describe, expect, it } from 'vitest';
import { createOverrideSchema, prepareStepParametersSchema, stepParametersSchemas } from './studies';

const prepare = {
  elements: ['Zr', 'Nb', 'La'],
  transform: 'clr',
  alrDenominator: null,
  belowDetection: 'dl-half',
  covariance: 'classic',
  seed: 7,
};

describe('card settings', () => {
  it('accepts a complete Prepare card', () => {
    expect(prepareStepParametersSchema.parse(prepare).elements).toEqual(['Zr', 'Nb', 'La']);
  });

  it('asks for an alr denominator among the chosen elements', () => {
    const result = prepareStepParametersSchema.safeParse({ ...prepare, transform: 'alr', alrDenominator: 'Th' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ['alrDenominator'] });
  });

  it('refuses an element chosen twice', () => {
    expect(prepareStepParametersSchema.safeParse({ ...prepare, elements: ['Zr', 'Zr'] }).success).toBe(false);
  });

  it('needs a written reason to exclude a member, and each member once', () => {
    const check = stepParametersSchemas.check;
    expect(check.safeParse({ exclusions: [{ sampleId: 'S1', group: 'A', reason: 'bad' }] }).success).toBe(false);
    const exclusion = { sampleId: 'S1', group: 'A', reason: 'Contaminated during digestion (lab log 14)' };
    expect(check.safeParse({ exclusions: [exclusion] }).success).toBe(true);
    expect(check.safeParse({ exclusions: [exclusion, exclusion] }).success).toBe(false);
  });

  it('keeps review and export free of settings', () => {
    expect(stepParametersSchemas.review.safeParse({ anything: 1 }).success).toBe(false);
  });
});

describe('overrides', () => {
  const reason = 'Field notes place this core segment in the eastern catchment';

  it('names a group for an assigned verdict and none for unassigned', () => {
    expect(createOverrideSchema.safeParse({ sampleId: 'U1', verdict: 'assigned', group: 'East', reason }).success).toBe(
      true,
    );
    expect(createOverrideSchema.safeParse({ sampleId: 'U1', verdict: 'assigned', group: null, reason }).success).toBe(
      false,
    );
    expect(
      createOverrideSchema.safeParse({ sampleId: 'U1', verdict: 'unassigned', group: 'East', reason }).success,
    ).toBe(false);
  });
});
