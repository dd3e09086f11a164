import type { StationStyle } from '@shared/domain';

/** How each station style reads, with an example. */
export const STATION_STYLE_LABELS: Record<StationStyle, string> = {
  '100': '100-unit stations (12+34.56)',
  '1000': '1000-unit stations (1+234.567)',
};
