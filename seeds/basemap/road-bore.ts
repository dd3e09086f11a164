/**
 * Base map of demo project (a), Tallowmere Parkway (EPSG:2278, US survey feet). Laid out from
 * the road section in seeds/demo/road-bore.ts: the parkway runs N 83° E and its centreline
 * crosses the bore at station 11+25; measured square to the centreline (north +) the four
 * 12-ft lanes end at ±24, the paved shoulders at ±34, the ditch flow lines at -50 and +48,
 * and the right-of-way at ±75. Pump Station 3 (where the bore starts) is south of the road,
 * the Quillfield subdivision to the north-east. Invented, like the rest of the demo.
 */
import { ROAD_BORE_SCENARIO } from '../demo/road-bore';
import { frame } from './frame';
import type { Basemap, BasemapFeature, BasemapLabel } from './types';

const bore = ROAD_BORE_SCENARIO.bores[0]!;
// Bore N 8° E from its first vertex; the road centreline crosses it 125 ft up-station (11+25).
const crossing = frame(bore.alignment[0]!, 8).at(125, 0);
const road = frame(crossing, 83);

const A0 = -1500;
const A1 = 1500;

const features: BasemapFeature[] = [];
const add = (kind: BasemapFeature['kind'], points: BasemapFeature['points']) => features.push({ kind, points });

// Fields and lots first (drawn underneath).
add('parcel-fill', road.rect(-1450, -180, 80, 420));
add('parcel-fill', road.rect(-160, 600, 80, 420));
add('parcel-fill', road.rect(-1450, -180, -80, -420));
add('parcel-fill', road.rect(40, 1450, -80, -420));

// Pump Station 3 site (launch pit side, south of the road).
add('site-fill', road.rect(-170, 30, -75, -260));
add('fence', [road.at(-165, -80), road.at(25, -80), road.at(25, -255), road.at(-165, -255), road.at(-165, -80)]);
add('building', road.rect(-110, -60, -140, -175));
add('building', road.rect(-40, -15, -200, -225));
add('gravel-surface', road.band(-34, -80, -140, -120));

// Tallowmere Parkway: pavement (lanes and shoulders), paint, ditches, right-of-way.
add('road-surface', road.band(34, -34, A0, A1));
add('road-edge', road.line(34, A0, A1));
add('road-edge', road.line(-34, A0, A1));
add('edge-line', road.line(24, A0, A1));
add('edge-line', road.line(-24, A0, A1));
add('lane-line', road.line(12, A0, A1));
add('lane-line', road.line(-12, A0, A1));
add('centre-line', road.line(0.6, A0, A1));
add('centre-line', road.line(-0.6, A0, A1));
add('ditch', road.line(48, A0, 600));
add('ditch', road.line(48, 700, A1));
add('ditch', road.line(-50, A0, A1));
add('right-of-way', road.line(75, A0, 620));
add('right-of-way', road.line(75, 680, A1));
add('right-of-way', road.line(-75, A0, A1));

// Quillfield Drive, a subdivision street joining from the north 650 ft east of the crossing.
const quill = frame(road.at(650, 0), 353);
add('road-surface', quill.band(15, -15, 30, 1100));
add('road-edge', quill.line(15, 34, 1100));
add('road-edge', quill.line(-15, 34, 1100));
add('right-of-way', quill.line(30, 75, 1100));
add('right-of-way', quill.line(-30, 75, 1100));
// Quillfield lots: 70 ft frontage, 130 ft deep, a house on each.
for (let i = 0; i < 9; i++) {
  const a0 = 110 + i * 80;
  for (const side of [1, -1] as const) {
    const near = side * 30;
    const far = side * 160;
    add('parcel-line', [quill.at(a0, near), quill.at(a0, far), quill.at(a0 + 80, far), quill.at(a0 + 80, near)]);
    if ((i + (side > 0 ? 0 : 1)) % 4 !== 3) add('building', quill.rect(a0 + 18, a0 + 62, side * 60, side * 110));
  }
}

// Property lines off the right-of-way.
for (const a of [-900, -400, -170, 30, 500, 1100]) add('parcel-line', [road.at(a, -75), road.at(a, -420)]);
for (const a of [-1000, -450, -160, 250]) add('parcel-line', [road.at(a, 75), road.at(a, 420)]);
add('parcel-line', road.line(-420, A0, A1));
add('parcel-line', road.line(420, A0, 620));
// A farmstead on the north side, west of the bore.
add('building', road.rect(-760, -700, 230, 270));
add('building', road.rect(-660, -590, 250, 300));
add('fence', [road.at(-1000, 180), road.at(-450, 180)]);

const labels: BasemapLabel[] = [
  ...[-950, -320, 320, 950].map((a): BasemapLabel => ({ text: 'Tallowmere Parkway', kind: 'street', at: road.at(a, 0), towards: road.at(a + 10, 0), minZoom: 15 })),
  { text: 'Quillfield Drive', kind: 'street', at: quill.at(420, 0), towards: quill.at(430, 0), minZoom: 16 },
  { text: 'Quillfield', kind: 'place', at: quill.at(700, 330), minZoom: 15 },
  { text: 'Pump Station 3', kind: 'site', at: road.at(-120, -200), minZoom: 17 },
  { text: 'Dunmere Farm', kind: 'minor', at: road.at(-680, 330), minZoom: 17 },
  { text: 'Right-of-way', kind: 'minor', at: road.at(-560, 69), towards: road.at(-550, 69), minZoom: 18 },
  { text: 'Right-of-way', kind: 'minor', at: road.at(-560, -69), towards: road.at(-550, -69), minZoom: 18 },
];

export const ROAD_BORE_BASEMAP: Basemap = {
  key: ROAD_BORE_SCENARIO.key,
  name: 'Tallowmere Parkway crossing',
  description: 'Invented base map of the Tallowmere Parkway demo: road, right-of-way, lots and buildings.',
  crsCode: ROAD_BORE_SCENARIO.project.crsCode,
  crsProj4: ROAD_BORE_SCENARIO.project.crsProj4,
  extent: (() => {
    const pts = [road.at(A0, -480), road.at(A0, 480), road.at(A1, -480), road.at(A1, 480)];
    return [Math.min(...pts.map((p) => p[0])), Math.min(...pts.map((p) => p[1])), Math.max(...pts.map((p) => p[0])), Math.max(...pts.map((p) => p[1]))];
  })(),
  features,
  labels,
};
