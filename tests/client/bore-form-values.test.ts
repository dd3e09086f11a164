/**
 * The Bores tab's form logic: the form's values turned into the create
 * and update bodies the shared schemas (`shared/schemas/bore.ts`, the server's contract) accept.
 *
 * (Pasted vertex and profile lists: tests/client/parse-pairs.test.ts.)
 *
 * Outside references: plan lengths use the 3-4-5 right triangle (Pythagoras, a worked example);
 * stations are read with the shared station parser, whose own tests check it against published
 * station notation; every body is re-checked with the shared zod schema itself.
 */
import { describe, expect, it } from 'vitest';
import { boreCreateSchema, boreUpdateSchema } from '@shared/schemas/bore';
import type { BoreDto } from '@shared/api';
import { boreValues, displayPath, emptyBoreValues, profileCoverageWarning, SHOWN_PATH, toBoreCreate, toBoreUpdate, type BoreFormValues } from '@/features/bores/utils/bore-form-values';

/** A filled-in new bore: a 3-4-5 alignment from (1000, 2000), begin station 1+000 (1000-unit stations). */
function filled(overrides: Partial<BoreFormValues> = {}): BoreFormValues {
  return {
    ...emptyBoreValues('1000'),
    name: 'Bore A',
    method: 'auger_bore',
    beginStation: '1+000',
    vertices: [
      { e: '1000', n: '2000' },
      { e: '1003', n: '2004' },
    ],
    casingOd: '0.3',
    toleranceHorizontal: '0.3',
    toleranceVertical: '0.15',
    minCover: '0.75',
    entryElevation: '125.5',
    exitElevation: '124.5',
    ...overrides,
  };
}

describe('toBoreCreate', () => {
  it('a straight profile runs from the begin station to begin + plan length (3-4-5: 5 units)', () => {
    const result = toBoreCreate(filled(), '1000');
    expect(result.errors).toBeNull();
    expect(result.input?.profile).toEqual([
      { station: 1000, elevation: 125.5 },
      { station: 1005, elevation: 124.5 },
    ]);
    expect(result.input?.beginStation).toBe(1000);
    expect(result.input?.alignment).toEqual([
      [1000, 2000],
      [1003, 2004],
    ]);
    expect(result.input?.groundProfile).toEqual([]);
    expect(result.input?.carrierSize).toBeNull();
    expect(boreCreateSchema.safeParse(result.input).success).toBe(true);
  });

  it('an empty form names every missing field, the straight profile on its entry and exit fields', () => {
    const result = toBoreCreate(emptyBoreValues('100'), '100');
    const shown = Object.keys(result.errors ?? {}).map((p) => displayPath(p, 'straight'));
    expect(shown).toEqual(
      expect.arrayContaining(['name', 'casingOd', 'toleranceHorizontal', 'toleranceVertical', 'minCover', 'alignment.0.0', 'alignment.1.1', 'entryElevation', 'exitElevation']),
    );
    expect(result.errors?.name).toBe('is required');
    // the default begin station 0+00.00 is fine
    expect(result.errors?.beginStation).toBeUndefined();
  });

  it('a station not in the project style says why, on the begin station', () => {
    const result = toBoreCreate(filled({ beginStation: '10+00' }), '1000');
    expect(result.errors?.beginStation).toMatch(/not a 1000-unit station/);
    expect(result.errors?.beginStation).toMatch(/100-unit station/);
  });

  it('unreadable numbers and a zero-length alignment are refused by field', () => {
    const result = toBoreCreate(filled({ casingOd: '0,3x', vertices: [{ e: '1000', n: '2000' }, { e: '1000', n: '2000' }] }), '1000');
    expect(result.errors?.casingOd).toMatch(/^must be a number/);
    expect(result.errors?.alignment).toMatch(/no length/);
  });

  it('a ground profile: stations parsed in the project style, in increasing order, two or more points', () => {
    const ok = toBoreCreate(filled({ groundPoints: [{ station: '1+000', elevation: '127.5' }, { station: '1+002.5', elevation: '127.2' }, { station: '1+005', elevation: '127.8' }] }), '1000');
    expect(ok.errors).toBeNull();
    expect(ok.input?.groundProfile).toEqual([
      { station: 1000, elevation: 127.5 },
      { station: 1002.5, elevation: 127.2 },
      { station: 1005, elevation: 127.8 },
    ]);
    expect(boreCreateSchema.safeParse(ok.input).success).toBe(true);
    const backwards = toBoreCreate(filled({ groundPoints: [{ station: '1+004', elevation: '127' }, { station: '1+001', elevation: '127' }] }), '1000');
    expect(backwards.errors?.['groundProfile.1.station']).toBe('stations must increase along the profile');
    const bad = toBoreCreate(filled({ groundPoints: [{ station: '1+000', elevation: '127' }, { station: '1+001', elevation: 'x' }, { station: '10+00', elevation: '127' }] }), '1000');
    expect(bad.errors?.['groundProfile.1.elevation']).toMatch(/^must be a number/);
    expect(bad.errors?.['groundProfile.2.station']).toMatch(/not a 1000-unit station/);
    const one = toBoreCreate(filled({ groundPoints: [{ station: '1+000', elevation: '127' }] }), '1000');
    expect(one.errors?.groundProfile).toBe('needs at least two points, or none');
    expect(SHOWN_PATH.test('groundProfile.2.station')).toBe(true);
  });

  it('profile points: stations are parsed in the project style and must increase (the schema rule)', () => {
    const ok = toBoreCreate(
      filled({ profileMode: 'points', profilePoints: [{ station: '1+000', elevation: '125' }, { station: '1+002.5', elevation: '124' }, { station: '1+005', elevation: '125' }] }),
      '1000',
    );
    expect(ok.input?.profile.map((p) => p.station)).toEqual([1000, 1002.5, 1005]);
    const bad = toBoreCreate(filled({ profileMode: 'points', profilePoints: [{ station: '1+004', elevation: '125' }, { station: '1+001', elevation: '124' }] }), '1000');
    expect(bad.errors?.['profile.1.station']).toBe('stations must increase along the profile');
  });
});

const SAVED: BoreDto = {
  id: 7,
  projectId: 1,
  name: 'Bore A',
  method: 'hdd',
  alignment: [
    [1000, 2000],
    [1003, 2004],
  ],
  beginStation: 1000,
  profile: [
    { station: 1000, elevation: 125 },
    { station: 1005, elevation: 125 },
  ],
  groundProfile: [],
  casingOd: 0.3,
  carrierSize: null,
  toleranceHorizontal: 0.3,
  toleranceVertical: 0.15,
  minCover: 0.75,
  notes: null,
  version: 4,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
};

describe('toBoreUpdate and the profile warning', () => {
  it('sends the edited fields and the ground profile with the version, never the casing profile', () => {
    const values = { ...boreValues(SAVED, '1000'), name: 'Bore A (revised)' };
    const result = toBoreUpdate(values, '1000', SAVED.version);
    expect(result.errors).toBeNull();
    expect(result.input).toMatchObject({ name: 'Bore A (revised)', version: 4, beginStation: 1000, casingOd: 0.3, groundProfile: [] });
    expect(result.input).not.toHaveProperty('profile');
    expect(boreUpdateSchema.safeParse(result.input).success).toBe(true);
  });

  it('shows a saved ground profile in the project style and sends it back as edited', () => {
    const saved: BoreDto = { ...SAVED, groundProfile: [{ station: 1000, elevation: 127.5 }, { station: 1002.5, elevation: 127.2 }, { station: 1005, elevation: 127.8 }] };
    const values = boreValues(saved, '1000');
    // 1000-unit station style: 1002.5 is 1+002.500 (shared station formatter)
    expect(values.groundPoints).toEqual([
      { station: '1+000.000', elevation: '127.5' },
      { station: '1+002.500', elevation: '127.2' },
      { station: '1+005.000', elevation: '127.8' },
    ]);
    const edited = { ...values, groundPoints: values.groundPoints.map((p, i) => (i === 1 ? { ...p, elevation: '127.075' } : p)) };
    const result = toBoreUpdate(edited, '1000', saved.version);
    expect(result.input?.groundProfile).toEqual([
      { station: 1000, elevation: 127.5 },
      { station: 1002.5, elevation: 127.075 },
      { station: 1005, elevation: 127.8 },
    ]);
    // and emptied: the bore then has no ground line
    expect(toBoreUpdate({ ...values, groundPoints: [] }, '1000', saved.version).input?.groundProfile).toEqual([]);
  });

  it('warns when the alignment would run past the casing profile, not when it stays inside', () => {
    expect(profileCoverageWarning(boreValues(SAVED, '1000'), SAVED, '1000')).toBeNull();
    const moved = profileCoverageWarning({ ...boreValues(SAVED, '1000'), beginStation: '1+002' }, SAVED, '1000');
    expect(moved).toContain('1+002.000 to 1+007.000');
    expect(moved).toContain('1+000.000 to 1+005.000');
  });
});
