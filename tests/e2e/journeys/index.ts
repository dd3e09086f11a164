import { BORE_JOURNEYS } from './bores';
import { CONFLICT_JOURNEYS } from './conflicts';
import { EXPORT_JOURNEYS } from './exports';
import { FIELD_REGISTER_JOURNEYS } from './field-register';
import { FOUNDATION_JOURNEYS } from './foundation';
import { LINE_JOURNEYS } from './lines';
import { OFFLINE_JOURNEYS } from './offline';
import { PLAN_PROFILE_JOURNEYS } from './plan-profile';
import type { Journey } from './support';

/**
 * Every browser journey, in order. They share one seeded database: journeys that only look
 * (or put back what they change) come first; journeys that add records (new holes and lines)
 * come last, so counts checked against the demo scenario still hold. The bores journey adds a
 * bore and deletes it again before it ends.
 */
export const JOURNEYS: Journey[] = [...FOUNDATION_JOURNEYS, ...PLAN_PROFILE_JOURNEYS, ...BORE_JOURNEYS, ...CONFLICT_JOURNEYS, ...FIELD_REGISTER_JOURNEYS, ...EXPORT_JOURNEYS, ...LINE_JOURNEYS, ...OFFLINE_JOURNEYS];
