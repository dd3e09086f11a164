import { CONFLICT_JOURNEYS } from './conflicts';
import { EXPORT_JOURNEYS } from './exports';
import { FIELD_REGISTER_JOURNEYS } from './field-register';
import { FOUNDATION_JOURNEYS } from './foundation';
import { PLAN_PROFILE_JOURNEYS } from './plan-profile';
import type { Journey } from './support';

/** Every browser journey, in order. Add a feature's journeys module here. */
export const JOURNEYS: Journey[] = [...FOUNDATION_JOURNEYS, ...FIELD_REGISTER_JOURNEYS, ...PLAN_PROFILE_JOURNEYS, ...CONFLICT_JOURNEYS, ...EXPORT_JOURNEYS];
