/**
 * The cautions of SPEC §7 as plain text, for exports and printed sheets (the client shows the
 * same points in its caution banner). They defer to local codes and licensed practice.
 */
export const SAFETY_CAUTIONS: readonly { lead: string; text: string }[] = [
  {
    lead: 'Call before you dig.',
    text: 'Notify the one-call centre and wait for the marks before any digging, test holes included.',
  },
  {
    lead: 'Inside the tolerance zone, dig by vacuum or hand only.',
    text: 'Within the locate tolerance zone around each mark, expose lines by vacuum excavation or careful hand digging.',
  },
  {
    lead: 'Enter trenches and pits only as the excavation safety rules allow.',
    text: 'A protective system where the rules require one, and inspection by a competent person, before anyone goes in.',
  },
  {
    lead: 'Entering a casing is confined-space work.',
    text: 'Permit, atmosphere testing, an attendant and a rescue plan, as the confined-space rules in force require.',
  },
  {
    lead: 'Clearances here are a design aid.',
    text: "A licensed engineer checks every figure against the line owner's and the local authority's requirements. Local codes and licensed practice govern.",
  },
];
