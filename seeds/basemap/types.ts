/**
 * Base-map linework of a demo area, in the demo project's grid and unit. `npm run tiles`
 * (scripts/render-tiles.ts) draws it into raster tiles; nothing else reads it.
 */
import type { GridPoint } from '@shared/schemas/common';

/** What a piece of linework is; the renderer's style table is keyed by it. */
export type BasemapKind =
  | 'parcel-fill' // polygon: a lot or field, light fill
  | 'site-fill' // polygon: a utility site (gravel yard)
  | 'road-surface' // polygon: paved travel lanes and shoulders
  | 'gravel-surface' // polygon: an unpaved lane
  | 'water' // polygon: water surface between the water's edges
  | 'building' // polygon: building outline
  | 'road-edge' // line: edge of pavement or shoulder
  | 'edge-line' // line: painted edge line (solid white)
  | 'lane-line' // line: painted lane line (dashed white)
  | 'centre-line' // line: painted centre line (double yellow)
  | 'right-of-way' // line: right-of-way line (dash-dot)
  | 'parcel-line' // line: property line
  | 'fence' // line: fence (short ticks)
  | 'ditch' // line: ditch flow line
  | 'creek-bank' // line: top of bank
  | 'creek-centreline'; // line: thalweg / centreline of the creek

export interface BasemapFeature {
  kind: BasemapKind;
  /** Grid points [easting, northing] in the project's unit; polygons are closed implicitly. */
  points: GridPoint[];
}

export type BasemapLabelKind = 'street' | 'creek' | 'place' | 'site' | 'minor';

export interface BasemapLabel {
  text: string;
  kind: BasemapLabelKind;
  /** Where the label's centre sits (grid). */
  at: GridPoint;
  /** A second grid point giving the reading direction (the label is turned to run towards it, kept upright). */
  towards?: GridPoint;
  /** Lowest zoom at which the label is drawn. */
  minZoom: number;
}

export interface Basemap {
  /** The demo scenario key (seeds/demo) this base map belongs to; also the MBTiles file name. */
  key: string;
  name: string;
  description: string;
  crsCode: string;
  crsProj4: string;
  /** Area to render, grid [minE, minN, maxE, maxN]. */
  extent: [number, number, number, number];
  features: BasemapFeature[];
  labels: BasemapLabel[];
}
