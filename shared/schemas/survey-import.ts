import { z } from 'zod';

/**
 * A surveyor's point file: CSV with a header row `point, northing, easting, elevation, description`.
 * The point is the test-hole number; the description starts with `TOP` (top of line) or `GND`
 * (ground), optionally followed by the line's label when one excavation exposed several lines.
 */
export const surveyImportSchema = z.strictObject({
  csv: z.string().min(1, 'the file is empty').max(2_000_000, 'the file is larger than 2 MB'),
  fileName: z.string().trim().max(200).optional(),
});
export type SurveyImportInput = z.infer<typeof surveyImportSchema>;
