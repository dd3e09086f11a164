import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO_SCENARIOS } from '../../../seeds/demo';
import { check, signIn, SIGNED_OUT_PROBE, type Journey } from './support';

const road = DEMO_SCENARIOS[0]!;
/** A demo line with test holes on it (TH-01 and TH-02 in seeds/demo/road-bore.ts): the server keeps it. */
const WATER = road.lines.find((l) => l.key === 'water-12')!;
const HELD_BY = road.holes.filter((h) => h.lineKey === 'water-12').map((h) => h.number);
/** The journey's own line, deleted again at the end so later journeys see the demo's lines. */
const LABEL = 'Journey test fibre, Corbel Lane';
/**
 * About 1,100 US ft north-east of the road project's bore (its lines lie around E 2,431,040–2,431,390,
 * N 13,652,380–13,652,580, EPSG:2278): far outside any clearance search, so no status changes.
 */
const VERTICES = ['2432500, 13653500', '2432600\t13653520'];

async function noSidewaysScroll(page: Page, where: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  check(overflow <= 1, `${where} scrolls sideways on a phone by ${overflow}px`);
}

async function openLines(page: Page) {
  await page.getByText(road.project.name).first().click();
  await page.getByRole('link', { name: /^Lines/ }).first().click();
  await page.getByRole('heading', { name: 'Lines', exact: true }).waitFor({ timeout: 15_000 });
}

export const LINE_JOURNEYS: Journey[] = [
  {
    name: 'lines: the designer on a phone adds a line by pasting its vertices, edits its record depth (a stale save shows both values), is refused deleting a line with test holes, and deletes the new line',
    allowErrors: [...SIGNED_OUT_PROBE, /409 \(Conflict\)/],
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 390, height: 844 });
      await signIn(page, baseUrl, 'designer');
      await openLines(page);

      // Add: an empty save names each field that is missing.
      await page.getByRole('button', { name: 'Add line', exact: true }).click();
      const form = page.getByRole('form', { name: 'Add a line' });
      await form.waitFor();
      await form.getByRole('button', { name: 'Add line' }).click();
      await form.getByText('Label is required').waitFor();
      await form.getByText('Owner is required').waitFor();
      await form.getByText('Record depth to top is required').waitFor();
      await form.getByText(/Plan path needs at least two vertices|Vertex 1 easting is required/).first().waitFor();
      // The form says where coordinates and depths are.
      await form.getByText(new RegExp(`Plan path \\(${road.project.crsCode}`)).waitFor();

      await form.getByLabel('Label', { exact: true }).fill(LABEL);
      await form.getByLabel('Owner', { exact: true }).fill('Corbel Lane Fibre Co.');
      await form.getByLabel('Contact e-mail').fill('records@corbel-fibre.example.com');
      await form.getByRole('radio', { name: 'Communications' }).check();
      await form.getByLabel('Outside diameter').fill('0.333');
      await form.getByLabel('Material').fill('HDPE duct');
      await form.getByLabel('Record depth to top').fill('3.5');
      // A bad pasted line is reported by its number and nothing is taken.
      await form.getByRole('button', { name: 'Paste vertices' }).click();
      await form.getByLabel('Pasted vertices').fill(`${VERTICES[0]}\n\n2432600, north`);
      await form.getByRole('button', { name: 'Replace the path with these' }).click();
      await form.getByRole('list', { name: 'Pasted lines not read' }).getByText('Line 3: “north” is not a number').waitFor();
      await form.getByLabel('Pasted vertices').fill(VERTICES.join('\n'));
      await form.getByRole('button', { name: 'Replace the path with these' }).click();
      check((await form.getByLabel('Vertex 2 northing').inputValue()) === '13653520', 'the pasted vertices did not fill the path');
      await noSidewaysScroll(page, 'the add-line form');
      await page.screenshot({ path: join(shots, 'lines-add-phone.png'), fullPage: true });
      await form.getByRole('button', { name: 'Add line' }).click();
      await page.getByText(`Line “${LABEL}” added.`).waitFor({ timeout: 15_000 });
      const link = page.getByRole('region', { name: 'Existing lines' }).getByRole('link', { name: LABEL });
      await link.or(page.getByRole('link', { name: LABEL })).first().waitFor();
      await noSidewaysScroll(page, 'the Lines table');

      // Open it and change its record depth.
      await page.getByRole('link', { name: LABEL }).click();
      await page.getByRole('heading', { name: LABEL }).waitFor({ timeout: 15_000 });
      await page.getByText('3.50 US ft below ground').waitFor();
      await page.getByRole('list', { name: 'Plan path vertices' }).getByRole('listitem').nth(1).waitFor();
      await page.getByRole('button', { name: 'Edit line' }).click();
      const edit = page.getByRole('form', { name: `Edit line ${LABEL}` });
      await edit.getByLabel('Record depth to top').fill('5.25');
      await noSidewaysScroll(page, 'the edit-line form');
      // Someone else saves the line (version 1) while the form is open: the save is refused and both values are shown.
      const [, projectId, lineId] = /\/projects\/(\d+)\/lines\/(\d+)/.exec(page.url()) ?? [];
      const other = await page.request.patch(`${baseUrl}/api/projects/${projectId}/lines/${lineId}`, { data: { version: 1, notes: 'Owner confirmed by phone' } });
      check(other.status() === 200, `the other save answered ${other.status()}`);
      await edit.getByRole('button', { name: 'Save line' }).click();
      const both = edit.getByRole('list', { name: 'Values changed by the other save' });
      await both.getByText(/Notes: yours \(blank\); now saved Owner confirmed by phone/).waitFor({ timeout: 15_000 });
      await both.getByText(/Record depth to top: yours 5\.25; now saved 3\.5/).waitFor();
      check((await edit.getByLabel('Notes').inputValue()) === 'Owner confirmed by phone', 'the form was not refilled with the saved line');
      await edit.getByLabel('Record depth to top').fill('5.25');
      await edit.getByRole('button', { name: 'Save line' }).click();
      await page.getByText('Changes saved.').waitFor({ timeout: 15_000 });
      await page.getByText('5.25 US ft below ground').waitFor();
      await page.getByText('Owner confirmed by phone').waitFor();
      await noSidewaysScroll(page, 'the line page');
      await page.screenshot({ path: join(shots, 'lines-detail-phone.png'), fullPage: true });

      // A demo line with test holes is kept, and the refusal names its holes.
      await page.getByRole('link', { name: '← Lines' }).click();
      await page.getByRole('link', { name: WATER.label }).click();
      await page.getByRole('heading', { name: WATER.label }).waitFor({ timeout: 15_000 });
      const holesPanel = page.getByRole('list', { name: 'Test holes on this line' });
      for (const n of HELD_BY) await holesPanel.getByRole('link', { name: n }).waitFor({ timeout: 15_000 });
      await page.getByRole('button', { name: 'Delete…' }).click();
      await page.getByRole('button', { name: 'Delete this line' }).click();
      const refusal = page.getByRole('alert').filter({ hasText: 'This line is kept' });
      await refusal.waitFor({ timeout: 15_000 });
      for (const n of HELD_BY) await refusal.getByRole('link', { name: n }).waitFor();
      await page.screenshot({ path: join(shots, 'lines-delete-refused-phone.png'), fullPage: true });
      await page.getByRole('button', { name: 'Keep it' }).click();

      // Delete the journey's own line: back to the register without it.
      await page.getByRole('link', { name: '← Lines' }).click();
      await page.getByRole('link', { name: LABEL }).click();
      await page.getByRole('heading', { name: LABEL }).waitFor({ timeout: 15_000 });
      await page.getByRole('button', { name: 'Delete…' }).click();
      await page.getByRole('button', { name: 'Delete this line' }).click();
      await page.getByText(`Line “${LABEL}” deleted.`).waitFor({ timeout: 15_000 });
      await page.getByRole('link', { name: WATER.label }).waitFor();
      check((await page.getByRole('link', { name: LABEL }).count()) === 0, 'the deleted line is still in the register');
    },
  },
];
