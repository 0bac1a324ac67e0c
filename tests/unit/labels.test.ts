/** Pages name the scenario's fields in words, from the one table of labels. */
import { describe, expect, it } from 'vitest';
import {
  documentFieldLabel,
  modelLabel,
  modelShortLabel,
  parameterLabel,
} from '../../src/engine/core';

describe('labels', () => {
  it('names model parameters as the form does, and kinds in words', () => {
    expect(parameterLabel('jumpIntensity')).toBe('Intensity λ (per year)');
    expect(parameterLabel('v0')).toBe('Initial variance v₀');
    expect(parameterLabel('upMean')).toBe('Mean up log-jump');
    expect(modelLabel('bates')).toBe('Bates (Heston + lognormal jumps)');
    expect(modelShortLabel('heston-kou')).toBe('Heston-Kou');
  });

  it('names document fields in words, and leaves an unknown path as it is', () => {
    expect(documentFieldLabel('model.jumpIntensity')).toBe('Intensity λ (per year)');
    expect(documentFieldLabel('stress.spotShift')).toBe('Spot gap');
    expect(documentFieldLabel('market.dividendYield')).toBe('Dividend yield');
    expect(documentFieldLabel('desk.colour')).toBe('desk.colour');
  });
});
