/**
 * Base map of demo project (b), Quarrow Creek (EPSG:26914, metres). Laid out from the creek
 * section in seeds/demo/creek-hdd.ts: the valley runs square to the drill, with the top of the
 * west bank at 0+062, the bed from 0+086 to 0+098 and the top of the east bank at 0+116; the
 * creek wanders away from that straight reach up- and downstream. Old Quarrow Mill Road runs
 * N 12° E west of the creek with the 8-in water main 9 m west of its centreline and the fibre
 * on its east verge; two farm lanes east of the creek carry the gas main and the primary.
 * Invented, like the rest of the demo.
 */
import type { GridPoint } from '@shared/schemas/common';
import { CREEK_HDD_SCENARIO } from '../demo/creek-hdd';
import { frame } from './frame';
import type { Basemap, BasemapFeature, BasemapLabel } from './types';

const s = CREEK_HDD_SCENARIO;
const line = (key: string) => s.lines.find((l) => l.key === key)!.path;
const bore = s.bores[0]!;

// The drill's first leg runs S 83° E; the creek crosses it square (N 7° E) at 0+092.
const creekOrigin = frame(bore.alignment[0]!, 97).at(92, 0);
const creek = frame(creekOrigin, 7);
/** Sideways wander of the creek (metres to the left of N 7° E), nil along the reach the drill crosses. */
function wander(a: number): number {
  const d = Math.max(0, Math.abs(a) - 45);
  return 14 * Math.sin(d / 70) * Math.min(1, d / 60) * (a < 0 ? -1 : 1);
}
function creekLine(offset: number, from = -420, to = 420, step = 10): GridPoint[] {
  const pts: GridPoint[] = [];
  for (let a = from; a <= to; a += step) pts.push(creek.at(a, offset + wander(a)));
  return pts;
}

const water8 = line('water-8');
// Road centreline 9 m east of the water main (the right of its N 12° E direction).
const roadFrame = frame(water8[0]!, 12);
const road = frame(roadFrame.at(0, -9), 12);
const R0 = -250;
const R1 = 650;

const gas = line('gas-4');
const lane1 = frame(gas[0]!, 40); // farm lane beside the gas main, 3 m to its north-west
const elec = line('elec-primary');
const lane2 = frame(elec[0]!, 175); // east farm lane, 3 m east of the primary

const features: BasemapFeature[] = [];
const add = (kind: BasemapFeature['kind'], points: GridPoint[]) => features.push({ kind, points });

// Offsets are to the left of each frame's direction: west of the creek and the road (both
// run north), east of the south-running east farm lane.
// Pastures: west of the road, between the road and the creek, east of the creek.
add('parcel-fill', road.rect(R0, R1, 14, 320));
add('parcel-fill', [...creekLine(34)].concat([road.at(R1, -14), road.at(R0, -14)]));
add('parcel-fill', [...creekLine(-28)].concat([creek.at(420, -420), creek.at(-420, -420)]));

// Quarrow Creek: water surface, banks (top of the west bank 30 m west of the centreline at the
// crossing, the east bank 24 m east), centreline.
add('water', [...creekLine(6), ...creekLine(-6).reverse()]);
add('creek-bank', creekLine(30));
add('creek-bank', creekLine(-24));
add('creek-centreline', creekLine(0));

// Old Quarrow Mill Road: a two-lane rural road, 7.2 m of pavement in a 24 m right-of-way.
add('road-surface', road.band(3.6, -3.6, R0, R1));
add('road-edge', road.line(3.6, R0, R1));
add('road-edge', road.line(-3.6, R0, R1));
add('centre-line', road.line(0.1, R0, R1));
add('centre-line', road.line(-0.1, R0, R1));
add('ditch', road.line(7, R0, R1));
add('ditch', road.line(-7, R0, R1));
add('right-of-way', road.line(12, R0, R1));
add('right-of-way', road.line(-12, R0, R1));

// Farm lanes east of the creek (gravel).
add('gravel-surface', lane1.band(5, 1, -40, 260));
add('gravel-surface', lane2.band(1, 5, -140, 260));

// Fences and property lines.
add('fence', [lane1.at(-40, 7), lane1.at(260, 7)]);
add('fence', [road.at(R0, 14), road.at(R1, 14)]);
add('parcel-line', [road.at(R0, 12), road.at(R1, 12)]);
add('parcel-line', [road.at(R0, -12), road.at(R1, -12)]);
add('parcel-line', creekLine(0, -420, 420, 20));
add('parcel-line', [road.at(120, 12), road.at(120, 320)]);
add('parcel-line', [creek.at(-260, -24 + wander(-260)), creek.at(-260, -420)]);

// Farmstead east of the creek, mill ruin on the west bank.
const farm = frame(lane2.at(200, 8), 85);
add('building', farm.rect(10, 32, 0, -14));
add('building', farm.rect(45, 80, 5, -20));
add('building', farm.rect(-8, 4, -4, -16));
add('building', creek.rect(-126, -114, 36 + wander(-120), 46 + wander(-120)));
// Houses along the road.
for (const a of [-180, -60, 380, 520]) add('building', road.rect(a, a + 14, 30, 42));

const labels: BasemapLabel[] = [
  { text: 'Quarrow Creek', kind: 'creek', at: creek.at(-150, wander(-150)), towards: creek.at(-140, wander(-140)), minZoom: 15 },
  { text: 'Quarrow Creek', kind: 'creek', at: creek.at(230, wander(230)), towards: creek.at(240, wander(240)), minZoom: 16 },
  ...[-120, 300].map((a): BasemapLabel => ({ text: 'Old Quarrow Mill Road', kind: 'street', at: road.at(a, 0), towards: road.at(a + 10, 0), minZoom: 15 })),
  { text: 'Old Quarrow Mill (ruin)', kind: 'minor', at: creek.at(-120, 41 + wander(-120) + 14), minZoom: 18 },
  { text: 'Farm lane', kind: 'minor', at: lane1.at(200, 3), towards: lane1.at(210, 3), minZoom: 18 },
  { text: 'Farm lane', kind: 'minor', at: lane2.at(-100, 3), towards: lane2.at(-90, 3), minZoom: 18 },
  { text: 'Ashcombe Farm', kind: 'place', at: farm.at(40, 30), minZoom: 16 },
];

export const CREEK_HDD_BASEMAP: Basemap = {
  key: s.key,
  name: 'Quarrow Creek crossing',
  description: 'Invented base map of the Quarrow Creek demo: creek, banks, road, farm lanes and buildings.',
  crsCode: s.project.crsCode,
  crsProj4: s.project.crsProj4,
  extent: [creekOrigin[0] - 420, creekOrigin[1] - 330, creekOrigin[0] + 380, creekOrigin[1] + 330],
  features,
  labels,
};
