/**
 * Number fields of every form (src/lib/form.ts): a typed comma is refused rather than guessed.
 * "2,5" is 2.5 where a decimal comma is the custom and 25 where the comma groups thousands; a
 * wrong guess puts a line's depth or offset ten times off (common practice: refuse ambiguous
 * input). The message names the rule.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { asNumberOrNull, asNumberOrUndefined } from '@/lib/form';

describe('number fields', () => {
  it('when a number is typed with a point, then it is read as typed', () => {
    expect(asNumberOrNull('2.5')).toBe(2.5);
    expect(asNumberOrNull(' -0.75 ')).toBe(-0.75);
    expect(asNumberOrNull('1234.5')).toBe(1234.5);
  });

  it('when a comma is typed, as a decimal mark or between thousands, then the value fails validation', () => {
    for (const typed of ['2,5', '1,234.5', '-0,5']) {
      const value = asNumberOrNull(typed);
      expect(Number.isNaN(value)).toBe(true);
      expect(z.number().safeParse(value).success).toBe(false);
    }
  });

  it('when the field is blank, then it is empty (null, or undefined for required fields)', () => {
    expect(asNumberOrNull('')).toBeNull();
    expect(asNumberOrNull('   ')).toBeNull();
    expect(asNumberOrUndefined('')).toBeUndefined();
  });
});
