import { z } from 'zod';
import { BORE_METHODS, PIT_KINDS } from '../domain';
import { finite, length, optionalText, polyline, positiveLength, profilePoint, requiredText, ring } from './common';

/** Profile points must be in increasing station order. */
const orderedProfile = (min: number) =>
  z
    .array(profilePoint)
    .min(min, `needs at least ${min} points`)
    .max(5000)
    .superRefine((points, ctx) => {
      for (let i = 1; i < points.length; i++) {
        if (points[i]!.station <= points[i - 1]!.station) {
          ctx.addIssue({
            code: 'custom',
            path: [i, 'station'],
            message: 'stations must increase along the profile',
          });
        }
      }
    });

export const boreCreateSchema = z.strictObject({
  name: requiredText(120),
  method: z.enum(BORE_METHODS),
  alignment: polyline,
  beginStation: finite,
  profile: orderedProfile(2),
  groundProfile: orderedProfile(0),
  casingOd: positiveLength,
  carrierSize: length.nullish(),
  toleranceHorizontal: length,
  toleranceVertical: length,
  minCover: length,
  notes: optionalText(),
});
export type BoreCreateInput = z.infer<typeof boreCreateSchema>;

export const boreUpdateSchema = boreCreateSchema
  .partial()
  .extend({ version: z.number().int().positive() })
  .strict();
export type BoreUpdateInput = z.infer<typeof boreUpdateSchema>;

export const pitCreateSchema = z.strictObject({
  boreId: z.number().int().positive(),
  kind: z.enum(PIT_KINDS),
  footprint: ring,
  bottomElevation: finite,
  notes: optionalText(),
});
export type PitCreateInput = z.infer<typeof pitCreateSchema>;

export const pitUpdateSchema = pitCreateSchema
  .omit({ boreId: true })
  .partial()
  .extend({ version: z.number().int().positive() })
  .strict();
export type PitUpdateInput = z.infer<typeof pitUpdateSchema>;
