/** The direction-of-run reader lives in shared/ because the server draws a new unidentified line with it too. */
export { parseBearing } from '@shared/bearing';
