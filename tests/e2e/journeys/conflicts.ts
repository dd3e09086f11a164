/**
 * The project manager's and the surveyor's deliverables (issue 6): the manager lands on the
 * conflict register, sorts and filters it, moves a conflict open → in review → resolved by
 * redesign with a reason at each move, and mails one owner their conflicts; the administrator
 * then finds the message, with its CSV list attached, on Admin → Mail (the built-in development
 * mail catcher). A surveyor on a phone marks a confirmed crossing staked.
 *
 * Note for the exports feature: the journey also exports the conflict list as CSV; that
 * step belongs to the exports journey (it can start from this register: the filter is in the
 * address bar with the same parameters as the export endpoints).
 */
import { join } from 'node:path';
import Papa from 'papaparse';
import type { Page } from 'playwright-core';
import { DEMO_SCENARIOS } from '../../../seeds/demo';
import { check, demoUser, signIn, signOut, SIGNED_OUT_PROBE, type Journey } from './support';

const road = DEMO_SCENARIOS[0]!;
const STORM = road.lines.find((l) => l.kind === 'storm')!;
const WATER_DISTRICT = 'engineering@tallowmere-water.example.com';


/** Open the road project's register from wherever the manager landed. */
async function openRoadConflicts(page: Page) {
  if (!(await page.getByRole('heading', { name: road.project.name }).isVisible())) {
    await page.getByRole('link', { name: 'Projects', exact: true }).first().click();
    await page.getByRole('link', { name: road.project.name }).first().click();
    await page.getByRole('link', { name: 'Conflicts' }).first().click();
  }
  await page.getByRole('heading', { name: 'Conflicts', exact: true }).waitFor({ timeout: 10_000 });
}

async function moveTo(page: Page, button: string, target: string, reason: string) {
  await page.getByRole('group', { name: 'Move the conflict' }).getByRole('button', { name: button }).click();
  const form = page.getByRole('form', { name: `Move to ${target}` });
  await form.getByLabel('Reason').fill(reason);
  await form.getByRole('button', { name: `Move to ${target}` }).click();
  await form.waitFor({ state: 'detached', timeout: 10_000 });
  await page.getByRole('list', { name: 'Conflict history' }).getByText(reason).waitFor({ timeout: 10_000 });
}

export const CONFLICT_JOURNEYS: Journey[] = [
  {
    name: 'the manager lands on the conflict register, resolves a conflict by redesign with reasons and mails one owner; the administrator sees the message',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await page.goto(`${baseUrl}/sign-in`);
      await page.evaluate(() => localStorage.clear());
      await signIn(page, baseUrl, 'manager');

      // Landing: a manager starts on a conflict register, not the project list.
      await page.waitForURL(/\/projects\/\d+\/conflicts$/, { timeout: 10_000 });
      await openRoadConflicts(page);
      await page.getByRole('region', { name: 'Conflicts' }).waitFor({ timeout: 10_000 });
      await page.screenshot({ path: join(shots, 'conflicts-manager-desktop.png'), fullPage: true });

      // Sort by line, then filter to storm drains: the filter goes into the address bar.
      await page.getByRole('button', { name: /^Line/ }).click();
      check((await page.getByRole('columnheader', { name: /^Line/ }).getAttribute('aria-sort')) === 'ascending', 'the Line column did not sort ascending');
      await page.getByLabel('Line kind', { exact: true }).selectOption('storm');
      await page.waitForURL(/kind=storm/, { timeout: 5_000 });
      const rows = page.getByRole('region', { name: 'Conflicts' }).getByRole('row');
      await rows.nth(2).waitFor({ state: 'detached', timeout: 5_000 });
      check((await rows.count()) === 2, `expected the header and one storm-drain row, got ${await rows.count()} rows`);
      await page.getByRole('region', { name: 'Conflicts' }).getByText(STORM.label).waitFor();

      // Open it and move it through the workflow, a reason at each step.
      await page.getByRole('region', { name: 'Conflicts' }).getByRole('link', { name: /^C-\d+$/ }).click();
      await page.getByRole('heading', { name: new RegExp(`C-\\d+: ${STORM.label.replace(/[()]/g, '.')}`) }).waitFor({ timeout: 10_000 });
      await moveTo(page, 'Start review', 'In review', 'Checking the storm trunk invert against TH survey shots');
      await moveTo(page, 'Resolved by redesign', 'Resolved by redesign', 'Bore lowered 3.0 ft under the storm trunk, profile revision B');
      const history = page.getByRole('list', { name: 'Conflict history' });
      await history.getByText('Open → In review').waitFor();
      await history.getByText('In review → Resolved by redesign').waitFor();
      await page.getByText('set by a person; the clearance check will not change it').waitFor();
      await page.screenshot({ path: join(shots, 'conflict-detail-resolved.png'), fullPage: true });

      // Mail one owner: preview, keep only the water district, send.
      await page.getByRole('link', { name: '← All conflicts' }).click();
      await page.getByRole('button', { name: 'Mail owners…' }).click();
      await page.getByRole('button', { name: 'Preview recipients' }).click();
      await page.getByRole('checkbox', { name: WATER_DISTRICT }).waitFor({ timeout: 10_000 });
      for (const box of await page.getByRole('group', { name: 'Who gets what' }).getByRole('checkbox').all()) {
        const name = await box.evaluate((el) => (el as HTMLInputElement).labels?.[0]?.textContent ?? '');
        if (!name.startsWith(WATER_DISTRICT)) await box.uncheck();
      }
      await page.getByRole('button', { name: 'Send to 1 owner' }).click();
      await page.getByText('Queued 1 message').waitFor({ timeout: 10_000 });
      await page.screenshot({ path: join(shots, 'conflicts-mail-owners.png'), fullPage: true });
      await signOut(page);

      // The administrator sees it caught by the development mail server, with the list attached.
      await signIn(page, baseUrl, 'admin');
      await page.getByRole('link', { name: 'Mail', exact: true }).click();
      const caught = page.getByRole('list', { name: 'Captured messages' }).getByRole('listitem').filter({ hasText: `To ${WATER_DISTRICT}` });
      await caught.first().waitFor({ timeout: 20_000 });
      await caught.first().getByText(/Attached: conflicts-.+\.csv/).waitFor();
      await caught.first().getByRole('button', { name: 'Show text' }).click();
      await caught.first().getByText(/Grid EPSG:2278; lengths in US survey feet/).waitFor({ timeout: 10_000 });
      await page.screenshot({ path: join(shots, 'admin-mail.png'), fullPage: true });
      check(demoUser('admin').role === 'admin', 'admin demo user');
    },
  },
  {
    name: 'a surveyor on a phone filters the stake-out list by bore and marks a confirmed crossing staked',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 390, height: 844 });
      await signIn(page, baseUrl, 'surveyor');
      await page.getByText(road.project.name).first().click();
      await page.getByRole('link', { name: 'Stake-out' }).first().click();
      await page.getByRole('heading', { name: 'Stake-out' }).waitFor({ timeout: 10_000 });
      const bore = road.bores[0]!;
      await page.getByLabel('Bore', { exact: true }).selectOption({ label: bore.name });
      await page.getByRole('button', { name: /^Confirmed crossing/ }).click();
      const first = page.getByRole('list', { name: 'Points to stake' }).getByRole('listitem').first();
      await first.getByText('Not staked').waitFor({ timeout: 10_000 });
      await first.getByRole('button', { name: 'Mark staked' }).click();
      await first.getByLabel('Note').fill('Hub and lath, blue paint');
      await first.getByRole('button', { name: 'Save' }).click();
      await first.getByText(`by ${demoUser('surveyor').name}`).waitFor({ timeout: 10_000 });
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      check(overflow <= 1, `the stake-out page scrolls sideways on a phone by ${overflow}px`);
      await page.screenshot({ path: join(shots, 'stakeout-surveyor-phone.png'), fullPage: true });

      // The names on the screen are the names in the point file the surveyor loads into the data
      // collector, for the same filter (bore; kind of point), read back with papaparse.
      const projectId = /\/projects\/(\d+)\//.exec(page.url())?.[1];
      check(projectId !== undefined, `no project id in ${page.url()}`);
      const boreId = new URL(page.url()).searchParams.get('bore');
      const screenNames = async () =>
        (await page.getByRole('list', { name: 'Points to stake' }).getByRole('listitem').evaluateAll((items) => items.map((li) => li.getAttribute('aria-label')))).map((l) =>
          String(l).replace(/^Point /, ''),
        );
      const fileNames = async (query: string) => {
        const res = await page.request.get(`${baseUrl}/api/projects/${projectId}/exports/stakeout.csv?${query}`);
        check(res.ok(), `stake-out point file: HTTP ${res.status()}`);
        return Papa.parse<Record<string, string>>(await res.text(), { header: true, comments: '#', skipEmptyLines: true }).data.map((r) => r.point);
      };
      const crossings = await screenNames();
      check(JSON.stringify(crossings) === JSON.stringify(await fileNames(`boreId=${boreId}&set=crossings`)), `screen ${crossings.join(' ')} ≠ point file`);
      await page.getByRole('button', { name: /^All/ }).click();
      await page.getByRole('list', { name: 'Points to stake' }).getByRole('listitem').nth(crossings.length).waitFor({ timeout: 10_000 });
      const all = await screenNames();
      check(all.some((n) => n.startsWith('P')), `no pit corners on the screen: ${all.join(' ')}`);
      check(JSON.stringify(all) === JSON.stringify(await fileNames(`boreId=${boreId}`)), `screen ${all.join(' ')} ≠ point file`);

      // On a desktop the cards sit two abreast: a coordinate stays on one line ("US ft" does not wrap).
      await page.setViewportSize({ width: 1280, height: 900 });
      const wrapped = await page.getByRole('list', { name: 'Points to stake' }).locator('dd').evaluateAll((dds) =>
        dds.filter((dd) => !dd.querySelector('span') && dd.getClientRects()[0]!.height > parseFloat(getComputedStyle(dd).lineHeight) * 1.5).map((dd) => dd.textContent),
      );
      check(wrapped.length === 0, `values wrap on a desktop card: ${wrapped.join(' | ')}`);
      await page.screenshot({ path: join(shots, 'stakeout-surveyor-desktop.png'), fullPage: true });
    },
  },
];
