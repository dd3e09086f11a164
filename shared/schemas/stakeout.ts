import { z } from 'zod';
import { isoDate, optionalText } from './common';

/** Kinds of points on the stake-out list. */
export const STAKE_POINT_KINDS = ['crossing', 'suggested_hole', 'pit_corner'] as const;
export type StakePointKind = (typeof STAKE_POINT_KINDS)[number];

export const STAKE_POINT_KIND_LABELS: Record<StakePointKind, string> = {
  crossing: 'Confirmed crossing',
  suggested_hole: 'Suggested test hole',
  pit_corner: 'Pit corner',
};

/** `?boreId=3`: the stake-out list of one bore. */
export const stakeoutQuerySchema = z.object({
  boreId: z.coerce.number().int().positive().optional(),
});
export type StakeoutQuery = z.infer<typeof stakeoutQuerySchema>;

/**
 * The surveyor marks a point staked. `key` is the point's stable id from the list
 * (`crossing:<boreId>:<lineId>`, `suggested:<boreId>:<lineId>:<reason>`, `pit:<pitId>:<corner>`);
 * the position staked is taken from the list as it stands, so a later move of the point shows.
 */
export const stakeMarkSchema = z.strictObject({
  key: z.string().trim().min(1, 'is required').max(120),
  /** When it was staked; now when omitted. */
  stakedAt: isoDate.optional(),
  note: optionalText(1000),
});
export type StakeMarkInput = z.infer<typeof stakeMarkSchema>;
