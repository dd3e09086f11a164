/** Base-map linework of the demo areas, one per demo scenario (keyed like seeds/demo). */
import { CREEK_HDD_BASEMAP } from './creek-hdd';
import { ROAD_BORE_BASEMAP } from './road-bore';
import type { Basemap } from './types';

export type { Basemap, BasemapFeature, BasemapLabel, BasemapKind } from './types';

export const DEMO_BASEMAPS: Basemap[] = [ROAD_BORE_BASEMAP, CREEK_HDD_BASEMAP];
