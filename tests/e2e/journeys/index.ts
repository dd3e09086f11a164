import { FOUNDATION_JOURNEYS } from './foundation';
import type { Journey } from './support';

/** Every browser journey, in order. Add a feature's journeys module here. */
export const JOURNEYS: Journey[] = [...FOUNDATION_JOURNEYS];
