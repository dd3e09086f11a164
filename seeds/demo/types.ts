/**
 * Shapes of the invented demo scenario. Every record is the create input the API accepts
 * (shared/schemas), plus the keys that tie records together before they have database ids.
 * The seeder strips `key`, `lineKey`, `boreKey`, `pits`, `status`, `createdByEmail` and `photos`.
 */
import type { ClearanceStatus, HoleStatus } from '@shared/domain';
import type { UserCreateInput } from '@shared/schemas/auth';
import type { BoreCreateInput, PitCreateInput } from '@shared/schemas/bore';
import type { HoleCreateInput } from '@shared/schemas/hole';
import type { LineCreateInput } from '@shared/schemas/line';
import type { ClearanceRuleInput, ProjectCreateInput, ProjectSettings } from '@shared/schemas/project';

/** A demo account; `active: false` shows a former user whose records remain. */
export type DemoUser = UserCreateInput & { active?: boolean };

export type DemoPhotoKind = 'exposed' | 'marker' | 'restored';

export interface DemoPhoto {
  caption: string;
  kind: DemoPhotoKind;
}

/** A pit before its bore has an id. */
export type DemoPit = Omit<PitCreateInput, 'boreId'>;

export type DemoBore = BoreCreateInput & {
  key: string;
  pits: DemoPit[];
};

export type DemoLine = LineCreateInput & { key: string };

export type DemoHole = Omit<HoleCreateInput, 'lineId' | 'boreId' | 'clientId'> & {
  lineKey: string;
  /** The bore a station/offset position refers to. */
  boreKey?: string;
  /** Fixed client-made id, so seeding twice never makes a second record. */
  clientId: string;
  status: HoleStatus;
  surveyedEasting?: number;
  surveyedNorthing?: number;
  surveyedTopElevation?: number;
  surveyedGroundElevation?: number;
  createdByEmail: string;
  photos?: DemoPhoto[];
};

/**
 * What the scenario was designed to show for one line against the bore, worked out by hand
 * and re-computed with plain planar math by seeds/check-demo.ts. It is the story of the demo,
 * not a test oracle for the product's engine (which may weigh uncertainty differently).
 */
export interface IntendedClearance {
  /** `crossing`: the line crosses the bore alignment in plan; `parallel`: it never does. */
  relation: 'crossing' | 'parallel';
  status: ClearanceStatus;
  /** One sentence a presenter can read out. */
  story: string;
}

export interface DemoScenario {
  key: string;
  project: ProjectCreateInput & { settings: ProjectSettings };
  /** E-mails of the demo users who are members of the project. */
  members: string[];
  rules: ClearanceRuleInput[];
  bores: DemoBore[];
  lines: DemoLine[];
  holes: DemoHole[];
  /** Intended clearance picture per line key (kept apart so line records stay pure input). */
  intended: Record<string, IntendedClearance>;
}

/** The invented organisations behind the demo, for the README and the sign-in page. */
export interface DemoOrganisation {
  town: string;
  county: string;
  client: string;
  designFirm: string;
  surveyFirm: string;
  excavationFirm: string;
  boreContractors: string[];
  lineOwners: string[];
  blurb: string;
}
