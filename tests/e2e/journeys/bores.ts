/**
 * Bores tab (issue: entering bores and pits in the browser). On a phone, the designer adds a
 * short second bore to the creek demo by typing a two-vertex alignment across the demo's 8-in
 * water main, with a straight profile and a pasted three-point ground profile, then edits its casing (while someone else renames it: the stale save shows
 * both versions and the designer saves hers over it); Plan & profile then lists it and gives that line a
 * computed clearance status and the profile strip its least cover (from the ground profile as edited); the designer adds a launch pit, and finally deletes the bore (its
 * conflicts carry no decisions), so the demo data later journeys see is as seeded. A field crew
 * then sees the bores without any editing buttons.
 */
import type { Page } from 'playwright-core';
import { CLEARANCE_STATUSES } from '../../../shared/domain';
import { formatStation } from '../../../shared/geometry';
import { CREEK_HDD_SCENARIO } from '../../../seeds/demo';
import { check, signIn, SIGNED_OUT_PROBE, type Journey } from './support';

const BORE_NAME = 'Journey bore across the mill road main';

async function noSidewaysScroll(page: Page, where: string): Promise<void> {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  check(overflow <= 1, `${where}: the page scrolls sideways by ${overflow} px at 390 px wide`);
}

async function openBores(page: Page, projectName: string): Promise<void> {
  await page.getByRole('link', { name: 'Projects' }).first().click();
  await page.getByText(projectName).first().click();
  await page.getByRole('link', { name: 'Bores' }).first().click();
  await page.getByRole('heading', { name: 'Bores', exact: true }).waitFor({ timeout: 30_000 });
  await page.locator('[data-testid="bore-card"]').first().waitFor({ timeout: 30_000 });
}

export const BORE_JOURNEYS: Journey[] = [
  {
    name: 'bores: on a phone the designer adds a bore across a demo line, sees its clearance in Plan & profile, adds a pit, then deletes the bore',
    // the 409 of the deliberately stale save is logged by the browser
    allowErrors: [...SIGNED_OUT_PROBE, /409 \(Conflict\)/],
    async run({ page, baseUrl, shots }) {
      const s = CREEK_HDD_SCENARIO;
      const water = s.lines.find((l) => l.key === 'water-8');
      check(water && water.path.length === 2, 'the creek demo has no straight 8-in water main');
      // A point 30 % along the water main (south of the demo bore), and a bore running east across it there.
      const [[e0, n0], [e1, n1]] = water.path as [[number, number], [number, number]];
      const cross = { e: e0 + 0.3 * (e1 - e0), n: n0 + 0.3 * (n1 - n0) };
      const west = { e: +(cross.e - 12).toFixed(2), n: +cross.n.toFixed(2) };
      const east = { e: +(cross.e + 10).toFixed(2), n: +cross.n.toFixed(2) };
      const style = s.project.stationStyle;

      await page.setViewportSize({ width: 390, height: 844 });
      await signIn(page, baseUrl, 'designer');
      await openBores(page, s.project.name);
      const before = await page.locator('[data-testid="bore-card"]').count();

      await page.getByRole('button', { name: 'Add bore', exact: true }).click();
      const form = page.getByRole('form', { name: 'New bore' });
      await form.waitFor({ timeout: 15_000 });
      // the project's frame is shown beside the fields
      const frame = await form.getByTestId('bore-form-frame').innerText();
      check(frame.includes(s.project.crsCode) && frame.includes(s.project.verticalDatum) && frame.includes('metres'), `the form does not show the project's CRS, datum and unit: "${frame}"`);

      // nothing filled in: the problems name their fields
      await form.getByRole('button', { name: 'Add bore' }).click();
      await form.getByText('Name is required').first().waitFor({ timeout: 10_000 });
      await form.getByText('Casing outside diameter is required').first().waitFor({ timeout: 10_000 });
      await form.getByText('Vertex 1 easting is required').first().waitFor({ timeout: 10_000 });

      // a pasted list with a line that is not two numbers is refused and the line named
      await form.getByRole('button', { name: 'Paste vertices' }).click();
      await form.getByLabel('Pasted vertices').fill(`Easting, Northing\n${west.e}, ${west.n}\n${east.e} north`);
      await form.getByRole('button', { name: 'Replace the alignment with these' }).click();
      await form.getByRole('list', { name: 'Pasted lines not read' }).getByText('Line 3: “north” is not a number').waitFor({ timeout: 10_000 });
      await form.getByRole('button', { name: 'Paste vertices' }).click(); // close the paste box

      await form.getByLabel('Name', { exact: true }).fill(BORE_NAME);
      await form.getByLabel('Method').selectOption('auger_bore');
      await form.getByLabel('Begin station').fill(formatStation(0, style, 0));
      await form.getByLabel('Vertex 1 easting').fill(String(west.e));
      await form.getByLabel('Vertex 1 northing').fill(String(west.n));
      await form.getByLabel('Vertex 2 easting').fill(String(east.e));
      await form.getByLabel('Vertex 2 northing').fill(String(east.n));
      await form.getByLabel('Casing outside diameter').fill('0.3');
      await form.getByLabel('Tolerance, line').fill('0.3');
      await form.getByLabel('Tolerance, grade').fill('0.15');
      await form.getByLabel('Minimum cover').fill('0.75');
      await form.getByLabel('Entry elevation').fill('125.5');
      await form.getByLabel('Exit elevation').fill('125.5');
      // the ground profile, pasted as a surveyor's "station, elevation" list with a header line
      await form.getByRole('button', { name: 'Paste ground points' }).click();
      await form
        .getByLabel('Pasted ground points')
        .fill(`Station, Elevation\n${formatStation(0, style)}, 127.5\n${formatStation(11, style)} 127.2\n${formatStation(22, style)}\t127.8`);
      await form.getByRole('button', { name: 'Replace the ground profile with these' }).click();
      check((await form.getByLabel('Ground point 3 elevation').inputValue()) === '127.8', 'the pasted ground profile did not fill the rows');
      // the plan length is worked out from the typed vertices (22 m by construction)
      const length = await form.getByTestId('bore-form-length').innerText();
      check(/Plan length 22\.00+ m/.test(length), `plan length shown as "${length}", expected 22 m`);
      await noSidewaysScroll(page, 'the new-bore form');
      await page.screenshot({ path: `${shots}/bores-new-bore-phone.png`, fullPage: true });
      await form.getByRole('button', { name: 'Add bore' }).click();

      const card = page.locator(`[data-testid="bore-card"][data-bore-name="${BORE_NAME}"]`);
      await card.waitFor({ timeout: 30_000 });
      check((await page.locator('[data-testid="bore-card"]').count()) === before + 1, 'the new bore is not listed once');
      const facts = await card.innerText();
      check(/22\.00+ m/.test(facts) && facts.includes(formatStation(22, style)), `the new bore's card does not show its length and end station: ${facts.slice(0, 300)}`);

      // edit it: a larger casing, saved with its version
      const href = (await card.getByRole('link', { name: /with live clearances$/ }).getAttribute('href')) ?? '';
      const boreId = Number(/bore=(\d+)/.exec(href)?.[1]);
      const projectId = Number(/\/projects\/(\d+)/.exec(page.url())?.[1]);
      check(boreId > 0 && projectId > 0, `no bore or project id in ${href} / ${page.url()}`);
      await card.getByRole('button', { name: 'Edit bore' }).click();
      // found on the page: while the other name is shown, the card carries that name
      const editForm = page.getByRole('form', { name: `Edit ${BORE_NAME}` });
      await editForm.waitFor({ timeout: 15_000 });
      check((await editForm.getByLabel('Vertex 2 easting').inputValue()) === String(east.e), 'the edit form does not show the saved alignment');
      await editForm.getByLabel('Casing outside diameter').fill('0.35');
      // the saved ground profile is shown in the project's station style, and a point is lowered
      const groundStation = await editForm.getByLabel('Ground point 2 station').inputValue();
      check(groundStation === formatStation(11, style), `the edit form shows ground point 2 at "${groundStation}", not ${formatStation(11, style)}`);
      await editForm.getByLabel('Ground point 2 elevation').fill('127.075');
      await noSidewaysScroll(page, 'the edit-bore form');
      // meanwhile someone else renames the bore (a PATCH from this session, with the version the form holds)
      const renamed = await page.evaluate(async ({ projectId, boreId }) => {
        const url = `/api/projects/${projectId}/bores/${boreId}`;
        const bore = (await (await fetch(url)).json()) as { version: number };
        const res = await fetch(url, { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ version: bore.version, name: 'Renamed meanwhile' }) });
        return res.status;
      }, { projectId, boreId });
      check(renamed === 200, `the other save answered ${renamed}`);
      await editForm.getByRole('button', { name: 'Save bore' }).click();
      // the 409 shows both versions: their name beside mine, my casing beside theirs
      const compare = editForm.getByRole('region', { name: 'Your version and the saved version' });
      await compare.waitFor({ timeout: 30_000 });
      const compareText = await compare.innerText();
      check(compareText.includes('Renamed meanwhile') && compareText.includes(BORE_NAME) && compareText.includes('0.35') && compareText.includes('0.3'), `the stale view does not show both versions: ${compareText}`);
      await editForm.getByRole('button', { name: 'Save mine over theirs' }).click();
      await editForm.waitFor({ state: 'detached', timeout: 30_000 });
      await card.getByText('0.350 m (350 mm)').waitFor({ timeout: 30_000 });

      // a launch pit at the west end
      await card.getByRole('button', { name: 'Add pit' }).click();
      const pitForm = card.getByRole('form', { name: `New pit for ${BORE_NAME}` });
      await pitForm.waitFor({ timeout: 15_000 });
      const corners: [number, number][] = [
        [west.e - 3, west.n - 1.5],
        [west.e, west.n - 1.5],
        [west.e, west.n + 1.5],
        [west.e - 3, west.n + 1.5],
      ];
      for (const [i, [e, n]] of corners.entries()) {
        await pitForm.getByLabel(`Corner ${i + 1} easting`).fill(e.toFixed(2));
        await pitForm.getByLabel(`Corner ${i + 1} northing`).fill(n.toFixed(2));
      }
      await pitForm.getByLabel('Bottom elevation').fill('125.1');
      await noSidewaysScroll(page, 'the new-pit form');
      await pitForm.getByRole('button', { name: 'Add pit' }).click();
      await card.getByTestId('pit-row').getByText(/Launch pit: bottom 125\.10* m NAVD 88, 4-corner footprint/).waitFor({ timeout: 30_000 });

      // Plan & profile lists the bore, and the water main it crosses has a computed status
      await page.getByRole('link', { name: 'Plan & profile' }).first().click();
      const boreSelect = page.getByLabel('Bore', { exact: true });
      await boreSelect.waitFor({ timeout: 30_000 });
      await boreSelect.selectOption({ label: BORE_NAME });
      const row = page.locator(`[data-testid="clearance-table"] tbody tr[data-line-label="${water.label}"]`);
      await row.waitFor({ timeout: 30_000 });
      let status = '';
      for (let i = 0; i < 60; i++) {
        status = (await row.getAttribute('data-status')) ?? '';
        if ((CLEARANCE_STATUSES as readonly string[]).includes(status)) break;
        await page.waitForTimeout(500);
      }
      check((CLEARANCE_STATUSES as readonly string[]).includes(status), `the water main crossed by the new bore has status "${status}", not a computed clearance status`);
      // The least cover: ground − top of casing (cover measured to the pipe's top: common practice), worked by
      // hand from the typed values: at 0+011 the ground is 127.075 and the casing top 125.5 + 0.35 / 2, so
      // 1.40 m; at the ends 127.5 − 125.675 = 1.825 and 127.8 − 125.675 = 2.125, both more.
      const leastCover = `Least cover 1.40 m at ${formatStation(11, style)} (minimum 0.75 m)`;
      await page.getByText(leastCover).first().waitFor({ timeout: 30_000 });
      await page.screenshot({ path: `${shots}/bores-new-bore-plan.png`, fullPage: true });

      // delete it again: a confirm step, then it is gone (no decisions on its conflicts)
      await page.getByRole('link', { name: 'Bores' }).first().click();
      await card.waitFor({ timeout: 30_000 });
      await card.getByRole('button', { name: 'Delete bore' }).click();
      await card.getByRole('button', { name: 'Delete the bore for good' }).click();
      await card.waitFor({ state: 'detached', timeout: 30_000 });
      check((await page.locator('[data-testid="bore-card"]').count()) === before, 'the deleted bore is still listed');

      // a field crew reads the bores but is offered no bore or pit editing (bore.write is the designer's and the administrator's)
      await signIn(page, baseUrl, 'field');
      await openBores(page, s.project.name);
      for (const name of ['Add bore', 'Edit bore', 'Delete bore', 'Add pit']) {
        check((await page.getByRole('button', { name, exact: true }).count()) === 0, `a field crew is offered "${name}"`);
      }
    },
  },
];
