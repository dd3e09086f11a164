/**
 * Demo accounts: one per role, plus a second field crew and a former crew member whose
 * account is inactive but whose test holes remain. Names are invented; e-mails use the
 * reserved example.com domain as `<role>@threadline.example.com`.
 *
 * The passwords are public on purpose (printed at start and listed in the README): they
 * exist only in the demo database. Pattern: `demo-<mailbox>-2026`.
 */
import type { DemoUser } from './types';

export const DEMO_USERS: DemoUser[] = [
  { email: 'admin@threadline.example.com', name: 'Ines Calloway', role: 'admin', password: 'demo-admin-2026' },
  { email: 'manager@threadline.example.com', name: 'Theo Marchetti', role: 'manager', password: 'demo-manager-2026' },
  { email: 'designer@threadline.example.com', name: 'Priya Nandakumar', role: 'designer', password: 'demo-designer-2026' },
  { email: 'surveyor@threadline.example.com', name: 'Rufus Adeyemi', role: 'surveyor', password: 'demo-surveyor-2026' },
  { email: 'field@threadline.example.com', name: 'Luz Carrizales', role: 'field', password: 'demo-field-2026' },
  { email: 'field2@threadline.example.com', name: 'Owen Tresslar', role: 'field', password: 'demo-field2-2026' },
  { email: 'viewer@threadline.example.com', name: 'Hana Okorie', role: 'viewer', password: 'demo-viewer-2026' },
  {
    email: 'former-field@threadline.example.com',
    name: 'Barnaby Quist',
    role: 'field',
    password: 'demo-former-field-2026',
    active: false,
  },
];

/** Who each demo account stands for, for the README and the sign-in page. */
export const DEMO_USER_ROLES_TEXT: Record<string, string> = {
  'admin@threadline.example.com': 'Office administrator, Greywick & Thorne Engineering',
  'manager@threadline.example.com': 'Project manager, Greywick & Thorne Engineering',
  'designer@threadline.example.com': 'Design engineer, Greywick & Thorne Engineering',
  'surveyor@threadline.example.com': 'Survey crew chief, Kesterby Geomatics',
  'field@threadline.example.com': 'Crew 2 lead, Vantrell Hydro-Excavation',
  'field2@threadline.example.com': 'Crew 4 lead, Vantrell Hydro-Excavation',
  'viewer@threadline.example.com': 'Reviewer for Quarrow County road permits (member of the Tallowmere Parkway project only)',
  'former-field@threadline.example.com': 'Former crew 1 lead, Vantrell Hydro-Excavation (account inactive; dug TH-03 and TH-10 on the Tallowmere Parkway project)',
};
