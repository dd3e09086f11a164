import { describe, it, expect } from 'vitest';
import {
  CLEARANCE_PRESETS, LENGTH_250_FT, WATER_SEWER_SEPARATION, boreDefaultClearance, presetLength, presetRules,
} from '../../shared/geometry';
import { LINE_KINDS } from '../../shared/domain';
import { clearanceRuleSchema } from '../../shared/schemas/project';

describe('trade presets', () => {
  it('when converting the water–sewer separation then 10 ft = 3.048 m and 18 in = 0.4572 m', () => {
    // Source: Recommended Standards for Water Works (2018): water main to sewer 10 ft horizontal,
    // outside to outside; water 18 in above the sewer where they cross (REFERENCES.md, confirmed).
    expect(presetLength(WATER_SEWER_SEPARATION.horizontal, 'm')).toBe(3.048);
    expect(presetLength(WATER_SEWER_SEPARATION.vertical, 'm')).toBe(0.4572);
    expect(presetLength(WATER_SEWER_SEPARATION.horizontal, 'ft')).toBe(10);
    expect(presetLength(WATER_SEWER_SEPARATION.vertical, 'ft')).toBe(1.5);
    // On a US-survey-foot project the 2 ppm difference is below the 0.0001 rounding.
    expect(presetLength(WATER_SEWER_SEPARATION.horizontal, 'usft')).toBe(10);
  });

  it('when converting 250 ft then 76.2 m', () => {
    // 250 ft × 0.3048 m = 76.2 m exactly (common practice; international foot per NIST/NGS 2020).
    expect(presetLength(LENGTH_250_FT, 'm')).toBe(76.2);
  });

  it('when seeding rules then one per line kind, with sources, valid for the rule schema', () => {
    const rules = presetRules('m');
    expect(rules.map((r) => r.kind).sort()).toEqual([...LINE_KINDS].sort());
    for (const r of rules) {
      expect(r.source.length).toBeGreaterThan(10);
      expect(clearanceRuleSchema.safeParse(r).success).toBe(true);
    }
    // Bore default 24 in (REFERENCES: assumption, common practice) = 0.6096 m.
    expect(rules.find((r) => r.kind === 'electric')).toMatchObject({ vertical: 0.6096, horizontal: 0.6096 });
    expect(rules.find((r) => r.kind === 'electric')!.source).toMatch(/National Electrical Safety Code, rule 353/);
    expect(CLEARANCE_PRESETS.find((p) => p.kind === 'gas')!.sources[0]!.status).toBe('memory');
  });

  it('when the bore carries potable water then the sewer rule rises to 10 ft / 18 in', () => {
    // Recommended Standards for Water Works (2018): 10 ft horizontal; 18 in vertical (24 in bore default is larger).
    expect(presetRules('ft', 'water').find((r) => r.kind === 'sewer')).toMatchObject({ horizontal: 10, vertical: 2 });
    expect(presetRules('ft', 'sewer').find((r) => r.kind === 'water')).toMatchObject({ horizontal: 10, vertical: 2 });
    expect(presetRules('ft', null).find((r) => r.kind === 'sewer')).toMatchObject({ horizontal: 2, vertical: 2 });
  });

  it('when the cut is large then twice the cut diameter governs the bore default', () => {
    // REFERENCES: larger of 24 in and twice the cut diameter (memory). 1.5 ft cut → 3 ft; 0.5 ft cut → 2 ft.
    expect(boreDefaultClearance(1.5, 'ft')).toBe(3);
    expect(boreDefaultClearance(0.5, 'ft')).toBe(2);
  });
});
