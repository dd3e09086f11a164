/**
 * Self-check of the invented demo data. Run: npx tsx seeds/check-demo.ts
 *
 * Validates every record against the shared zod schemas, converts every coordinate with proj4
 * and checks it lies in the CRS's area of use, checks test holes sit on their lines, crossing
 * lines cross the bore in plan and parallel ones do not, hole numbers are unique, and prints
 * the clearance picture of each line (plain planar math, SPEC §4) beside the intended one.
 * Exits 1 on any problem.
 */
import { UNIT_SYMBOLS } from '@shared/units';
import { DEMO_SCENARIOS, DEMO_USERS } from './demo';
import { type LineClearance, checkUsers, formatStation, verifyScenario } from './demo/verify';

const f2 = (x: number | undefined) => (x == null ? '' : x.toFixed(2));

let problems = 0;
const userProblems = checkUsers(DEMO_USERS);
console.log(`Demo users: ${DEMO_USERS.length} (${DEMO_USERS.filter((u) => u.active === false).length} inactive)`);
for (const p of userProblems) console.log(`  PROBLEM ${p.where}: ${p.message}`);
problems += userProblems.length;

for (const s of DEMO_SCENARIOS) {
  const report = verifyScenario(s, DEMO_USERS);
  const unit = UNIT_SYMBOLS[s.project.unit];
  const bore = s.bores[0]!;
  console.log(`\n== ${s.project.name} (${s.key}): ${s.project.crsCode}, ${unit}, ${s.project.verticalDatum}`);
  console.log(
    `   ${s.lines.length} lines, ${s.holes.length} holes, ${s.rules.length} rules; bore ${bore.name} (${bore.method}), casing OD ${bore.casingOd} ${unit}, ` +
      `tolerance V ${bore.toleranceVertical} / H ${bore.toleranceHorizontal} ${unit}`,
  );
  const counts = s.holes.reduce<Record<string, number>>((acc, h) => ({ ...acc, [h.status]: (acc[h.status] ?? 0) + 1 }), {});
  console.log(`   holes by status: ${Object.entries(counts).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  console.log('');
  console.log(
    '   line'.padEnd(24) +
      'rel'.padEnd(10) +
      'station'.padEnd(12) +
      'top'.padStart(8) +
      'bore CL'.padStart(9) +
      'clear'.padStart(8) +
      'req'.padStart(7) +
      'margin'.padStart(8) +
      'allow'.padStart(7) +
      '  holes'.padEnd(16) +
      'status'.padEnd(12) +
      'intended',
  );
  for (const c of report.clearances) console.log(row(c, s.project.stationStyle));
  for (const c of report.clearances) {
    const story = s.intended[c.lineKey]?.story;
    if (story) console.log(`   - ${c.lineKey}: ${story}`);
  }
  if (report.pitNear.length) {
    for (const n of report.pitNear) console.log(`   note: ${n.lineKey} is ${n.distance.toFixed(2)} ${unit} from the ${n.pit} pit (within its horizontal requirement)`);
  } else {
    console.log('   pits: no line enters a pit footprint or comes within its horizontal requirement of one');
  }
  for (const p of report.problems) console.log(`   PROBLEM ${p.where}: ${p.message}`);
  problems += report.problems.length;
}

console.log(problems === 0 ? '\nDemo data OK.' : `\n${problems} problem(s).`);
process.exit(problems === 0 ? 0 : 1);

function row(c: LineClearance, style: '100' | '1000'): string {
  const holes = c.fromRecordDepth ? '(record)' : c.holesUsed.join(',') + (c.extrapolatedBy > 0 ? ` +${c.extrapolatedBy.toFixed(1)}` : '');
  return (
    `   ${c.lineKey}`.padEnd(24) +
    (c.relation === 'crossing' ? `x ${Math.round(c.skewDeg ?? 0)}°` : 'parallel').padEnd(10) +
    formatStation(c.station, style).padEnd(12) +
    f2(c.topElevation).padStart(8) +
    f2(c.boreCentreline).padStart(9) +
    f2(c.clearance).padStart(8) +
    f2(c.required).padStart(7) +
    f2(c.margin).padStart(8) +
    f2(c.allowance).padStart(7) +
    `  ${holes}${c.verified ? '' : ' (unverified)'}`.padEnd(16) +
    c.status.padEnd(12) +
    (c.intended === c.status ? 'as intended' : `INTENDED ${c.intended ?? '?'}`)
  );
}
