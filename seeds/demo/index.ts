/**
 * The invented demo: two projects of one invented water district, and the people who work
 * on them. Plain typed data; server/seed loads it, seeds/check-demo.ts checks it.
 */
import { CREEK_HDD_SCENARIO } from './creek-hdd';
import { DEMO_USERS, DEMO_USER_ROLES_TEXT } from './people';
import { ROAD_BORE_SCENARIO } from './road-bore';
import type { DemoOrganisation, DemoScenario } from './types';

export { DEMO_USERS, DEMO_USER_ROLES_TEXT, ROAD_BORE_SCENARIO, CREEK_HDD_SCENARIO };
export type { DemoScenario, DemoUser, DemoOrganisation } from './types';

/** (a) jack-and-bore under a four-lane road (US survey feet), (b) HDD under a creek (metres). */
export const DEMO_SCENARIOS: DemoScenario[] = [ROAD_BORE_SCENARIO, CREEK_HDD_SCENARIO];

/** Who is who in the demo. Every name is invented; any likeness to a real body is chance. */
export const DEMO_ORGANISATION: DemoOrganisation = {
  town: 'Tallowmere, Texas',
  county: 'Quarrow County',
  client: 'Tallowmere Regional Water District',
  designFirm: 'Greywick & Thorne Engineering',
  surveyFirm: 'Kesterby Geomatics',
  excavationFirm: 'Vantrell Hydro-Excavation',
  boreContractors: ['Ironmoss Trenchless (jack-and-bore)', 'Pellridge Directional (HDD)'],
  lineOwners: [
    'Tallowmere Regional Water District (water, sewer)',
    'Town of Tallowmere Public Works (storm drains)',
    'Sabline Gas Distribution',
    'Marrowfield Electric Cooperative',
    'Skeinlight Fiber',
    'Quarrow Valley Telephone Cooperative',
  ],
  blurb:
    'Tallowmere is an invented market town in invented Quarrow County, in the rolling farmland of ' +
    'south-central Texas. Its water district is extending mains to a new north pressure zone, ' +
    'and two crossings need care: a 24-in main jacked and bored under Tallowmere Parkway, a ' +
    'four-lane road crowded with older lines, and a 12-in main drilled under Quarrow Creek. Greywick & Thorne Engineering designs the crossings, Kesterby Geomatics ' +
    'surveys, and Vantrell Hydro-Excavation digs the test holes. The potholes have already found a ' +
    'storm trunk deeper than its records and a clay pipe nobody owns.',
};
