/**
 * The crew's and the surveyor's daily work on a phone (issue 4): a field user logs a test hole
 * by grid position and photographs it, the surveyor imports its shots from a point file, the
 * designer accepts it and it shows locked. Along the way the register's CSV export is read
 * back with papaparse (a general-purpose CSV reader) and checked for its header and text ids.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Jimp } from 'jimp';
import Papa from 'papaparse';
import type { Page } from 'playwright-core';
import { LINE_KIND_LABELS } from '../../../shared/domain';
import { gridToLonLat, projectCrs } from '../../../shared/geometry/crs';
import { DEMO_SCENARIOS } from '../../../seeds/demo';
import { check, demoUser, signIn, signOut, SIGNED_OUT_PROBE, type Journey } from './support';

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 800 };
const road = DEMO_SCENARIOS[0]!;
const HOLE = 'TH-90';
/** A ticket number with a leading zero: the CSV must keep it as text. */
const TICKET = '0026030911';
const CAPTION = `${HOLE}: gas main exposed, tape on top of pipe`;

/** A point half-way along the demo's gas main, so the hole sits on its line (road project grid, US ft). */
function pointOnGasMain(): { e: number; n: number; label: string; option: string } {
  const gas = road.lines.find((l) => l.key === 'gas-6')!;
  const [a, b] = [gas.path[0]!, gas.path[1]!];
  return {
    e: Math.round(((a[0] + b[0]) / 2) * 100) / 100,
    n: Math.round(((a[1] + b[1]) / 2) * 100) / 100,
    label: gas.label,
    option: `${gas.label} (${LINE_KIND_LABELS[gas.kind]}, QL-${gas.qualityLevel})`,
  };
}

async function noSidewaysScroll(page: Page, where: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  check(overflow <= 1, `${where}: the page scrolls sideways on a phone by ${overflow}px`);
}

async function openRoadHoles(page: Page, baseUrl: string, role: string) {
  await signIn(page, baseUrl, role);
  await page.getByText(road.project.name).first().click();
  await page.getByRole('link', { name: 'Test holes' }).first().click();
  await page.getByRole('heading', { name: 'Test holes' }).waitFor({ timeout: 10_000 });
}


async function openHole(page: Page) {
  await page.getByRole('searchbox', { name: 'Search holes' }).fill(HOLE);
  await page.getByRole('link', { name: HOLE, exact: true }).click();
  await page.getByRole('heading', { name: `Test hole ${HOLE}` }).waitFor({ timeout: 10_000 });
}

export const FIELD_REGISTER_JOURNEYS: Journey[] = [
  {
    name: 'field register: a crew logs a hole with a photo on a phone, the surveyor imports its shots, the designer accepts and it locks',
    allowErrors: [...SIGNED_OUT_PROBE],
    async run({ page, baseUrl, shots }) {
      const at = pointOnGasMain();
      await page.setViewportSize(PHONE);

      // 1. The crew logs the hole by grid position.
      await openRoadHoles(page, baseUrl, 'field');
      await page.getByRole('link', { name: 'Log a test hole' }).click();
      await page.getByRole('form', { name: 'Log a test hole' }).waitFor();
      await page.getByText(/call before you dig/i).first().waitFor();
      check((await page.getByLabel('Hole number').inputValue()) === 'TH-15', 'the next hole number after TH-14 is not suggested');
      check((await page.getByLabel('Crew').inputValue()) === demoUser('field').name, 'the crew is not prefilled with the signed-in crew member');
      // A decimal keypad on every measurement.
      for (const label of ['Easting', 'Northing', 'Ground elevation', 'Depth below ground', 'Measured size']) {
        check((await page.getByLabel(label, { exact: true }).getAttribute('inputmode')) === 'decimal', `${label} does not ask for a decimal keypad`);
      }
      // Saving an empty position names the fields.
      await page.getByLabel('Hole number').fill(HOLE);
      await page.getByRole('button', { name: 'Save test hole' }).click();
      await page.getByText('Line exposed is required').first().waitFor();
      await page.getByText('Easting is required').first().waitFor();
      await page.screenshot({ path: join(shots, 'field-register-form-errors-phone.png'), fullPage: true });

      await page.getByLabel('Line exposed').selectOption({ label: at.option });
      await page.getByLabel('Easting').fill(String(at.e));
      await page.getByLabel('Northing').fill(String(at.n));
      await page.getByLabel('Ground elevation').fill('428.40');
      await page.getByLabel('Depth below ground').fill('3.90');
      await page.getByLabel('Measured size').fill('0.55');
      await page.getByText('Outside diameter: 0.550 US ft (6.6 in).').waitFor();
      await page.getByLabel('Material').fill('Steel, yellow FBE coating');
      await page.getByLabel('Direction of run').fill('N 83° E');
      await page.getByLabel('Condition').fill('Coating intact');
      await page.getByLabel('One-call ticket number').fill(TICKET);
      await page.getByLabel('Surface type').fill('Grass');
      await page.getByRole('group', { name: 'Surface marker set' }).getByText('Yes', { exact: true }).click();
      await page.getByLabel('Soil').fill('Stiff brown clay');
      await noSidewaysScroll(page, 'logging form');
      await page.screenshot({ path: join(shots, 'field-register-form-phone.png'), fullPage: true });
      await page.getByRole('button', { name: 'Save test hole' }).click();

      await page.getByRole('heading', { name: `Test hole ${HOLE}` }).waitFor({ timeout: 10_000 });
      await page.getByText(`Test hole ${HOLE} saved`).waitFor();
      check((await page.getByRole('list', { name: 'Workflow' }).locator('[aria-current="step"]').innerText()).includes('Dug'), 'a hole logged with its depth is not dug');

      // 2. A photo, made here with jimp and given to the camera input.
      const jpeg = await new Jimp({ width: 96, height: 64, color: 0x3a6ea5ff }).getBuffer('image/jpeg');
      await page.getByLabel('Take photos').setInputFiles({ name: 'th90-exposed.jpg', mimeType: 'image/jpeg', buffer: jpeg });
      await page.getByRole('list', { name: 'Photos ready to upload' }).waitFor();
      await page.getByLabel('Caption for these photos').fill(CAPTION);
      await page.getByRole('button', { name: 'Upload 1 photo' }).click();
      await page.getByText('1 photo added.').waitFor({ timeout: 15_000 });
      const thumb = page.getByRole('list', { name: `Photos of test hole ${HOLE}` }).getByRole('img', { name: CAPTION });
      await thumb.waitFor({ timeout: 15_000 });
      await page.waitForFunction(
        (alt) => [...document.querySelectorAll('img')].some((i) => i.alt === alt && i.complete && i.naturalWidth > 0),
        CAPTION,
        { timeout: 15_000 },
      );
      await page.getByRole('button', { name: /^Open photo 1 of 1/ }).click();
      const viewer = page.getByRole('dialog', { name: new RegExp(`Photo 1 of 1, test hole ${HOLE}`) });
      await viewer.waitFor();
      await viewer.getByRole('img', { name: CAPTION }).waitFor();
      await page.screenshot({ path: join(shots, 'field-register-photo-viewer-phone.png') });
      // The caption is the alt text; changing it (PATCH photo) changes what is announced.
      await viewer.getByLabel('Caption').fill(`${CAPTION}, 3.9 ft`);
      await viewer.getByRole('button', { name: 'Save caption' }).click();
      await viewer.getByText('Caption saved.').waitFor({ timeout: 10_000 });
      await viewer.getByRole('img', { name: `${CAPTION}, 3.9 ft` }).waitFor();
      await page.keyboard.press('Escape');
      await viewer.waitFor({ state: 'hidden' });
      await noSidewaysScroll(page, 'hole page');
      await page.screenshot({ path: join(shots, 'field-register-hole-phone.png'), fullPage: true });
      await signOut(page);

      // 3. The surveyor imports the shots: first a file with a bad row (refused, nothing written), then the good one.
      await openRoadHoles(page, baseUrl, 'surveyor');
      await page.getByRole('link', { name: 'Import survey shots' }).click();
      const header = 'point,northing,easting,elevation,description';
      const top = `${HOLE},${(at.n + 0.04).toFixed(2)},${(at.e + 0.03).toFixed(2)},424.47,TOP`;
      const ground = `${HOLE},${(at.n + 0.5).toFixed(2)},${(at.e + 0.5).toFixed(2)},428.36,GND`;
      const bad = `${header}\n${top}\nTH-99,13652422.00,2431214.00,424.00,TOP\n`;
      await page.getByLabel('Point file', { exact: true }).setInputFiles({ name: 'shots-bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
      await page.getByText(/Nothing can be imported yet: 1 row needs attention/).waitFor({ timeout: 10_000 });
      await page.getByText('no test hole numbered TH-99 in this project').waitFor();
      check(await page.getByRole('button', { name: /^Import \d+ shots?$/ }).isDisabled(), 'import is offered while a row does not match');
      await noSidewaysScroll(page, 'import preview with a bad row');
      await page.screenshot({ path: join(shots, 'field-register-import-bad-phone.png'), fullPage: true });

      await page.getByLabel('Point file', { exact: true }).setInputFiles({ name: 'shots.csv', mimeType: 'text/csv', buffer: Buffer.from(`${header}\r\n${top}\r\n${ground}\r\n`) });
      await page.getByText('Every row matches: 2 shots on 1 hole').waitFor({ timeout: 10_000 });
      await page.getByText('424.470').first().waitFor();
      await noSidewaysScroll(page, 'import preview');
      await page.screenshot({ path: join(shots, 'field-register-import-preview-phone.png'), fullPage: true });
      await page.getByRole('button', { name: 'Import 2 shots' }).click();
      await page.getByText('Survey shots imported').waitFor({ timeout: 10_000 });
      await page.getByRole('link', { name: '← Test holes' }).click();
      await openHole(page);
      check((await page.getByRole('list', { name: 'Workflow' }).locator('[aria-current="step"]').innerText()).includes('Surveyed'), 'the hole is not surveyed after the import');
      await page.getByLabel('Depth and elevation').getByText('424.47 US ft NAVD 88').waitFor();
      check((await page.getByLabel('Depth and elevation').getByText('surveyed').count()) >= 2, 'surveyed values are not marked "surveyed"');
      await signOut(page);

      // 4. The designer accepts it; it shows locked with no edit controls.
      await openRoadHoles(page, baseUrl, 'designer');
      await openHole(page);
      await page.getByRole('button', { name: 'Accept and lock' }).click();
      await page.getByText('Reviewed and locked').first().waitFor({ timeout: 10_000 });
      check((await page.getByRole('link', { name: 'Edit hole' }).count()) === 0, 'a reviewed hole still offers Edit');
      check((await page.getByRole('button', { name: 'Take photos' }).count()) === 0, 'a reviewed hole still takes photos');
      await page.getByRole('button', { name: 'Reopen…' }).waitFor();
      await noSidewaysScroll(page, 'reviewed hole');
      await page.screenshot({ path: join(shots, 'field-register-locked-phone.png'), fullPage: true });

      await page.setViewportSize(DESKTOP);
      await page.screenshot({ path: join(shots, 'field-register-locked-desktop.png'), fullPage: true });
      // The one-page sheet the page links to is a PDF.
      const sheetHref = await page.getByRole('link', { name: 'Test-hole sheet (PDF)' }).getAttribute('href');
      const sheet = await page.request.get(`${baseUrl}${sheetHref}`);
      check(sheet.status() === 200 && (sheet.headers()['content-type'] ?? '').includes('application/pdf'), `the test-hole sheet answers ${sheet.status()} ${sheet.headers()['content-type']}`);
      check((await sheet.body()).subarray(0, 5).toString() === '%PDF-', 'the test-hole sheet is not a PDF');

      // 5. The register on a desktop, and its CSV export read back.
      await page.getByRole('link', { name: '← Test holes' }).click();
      await page.getByRole('searchbox', { name: 'Search holes' }).waitFor();
      await page.screenshot({ path: join(shots, 'field-register-table-desktop.png'), fullPage: true });
      // Filter by kind: the demo's gas holes plus the one just logged.
      const gasKeys = new Set(road.lines.filter((l) => l.kind === 'gas').map((l) => l.key));
      const gasHoles = road.holes.filter((h) => gasKeys.has(h.lineKey)).length + 1;
      await page.getByLabel('Kind').selectOption({ label: 'Gas' });
      await page.getByText(`Showing ${gasHoles} of 15 holes`).waitFor();
      await page.getByLabel('Kind').selectOption({ label: 'All' });
      await page.getByRole('searchbox', { name: 'Search holes' }).fill(HOLE);
      await page.getByText('Showing 1 of 15 holes').waitFor();
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV (1)' }).click()]);
      const csv = readFileSync((await download.path())!, 'utf8');
      const parsed = Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true });
      const [meta, cols, row] = parsed.data;
      check(meta && /CRS EPSG:2278/.test(meta[0]!) && /US survey feet/.test(meta[0]!) && /vertical datum NAVD 88/.test(meta[0]!) && /exported \d{4}-/.test(meta[0]!), `the CSV header line lacks CRS, unit, datum or time: ${meta?.[0]}`);
      check(/clearances checked \d{4}-/.test(meta![0]!), 'the CSV header line lacks the clearance-check time');
      check(cols && row && row.length === cols.length, 'the CSV row and header differ in length');
      const cell = (name: string) => row![cols!.indexOf(name)];
      check(cell('Hole') === `="${HOLE}"`, `hole number is not written as text: ${cell('Hole')}`);
      check(cell('One-call ticket') === `="${TICKET}"`, `the ticket number loses its leading zero: ${cell('One-call ticket')}`);
      check(cell('Status') === 'Reviewed', `status in the CSV is ${cell('Status')}`);
      check(cell(`Top of line elevation (US ft NAVD 88)`) === '424.47' && cell('Top of line from') === 'surveyed', 'the CSV does not carry the surveyed top of line');
      check(/filtered: search "TH-90"/.test(meta![0]!), 'the CSV header does not say the rows were filtered');
      await signOut(page);

      // 6. Back on the phone, the crew sees the hole locked.
      await page.setViewportSize(PHONE);
      await openRoadHoles(page, baseUrl, 'field');
      await openHole(page);
      await page.getByText('Reviewed and locked').first().waitFor();
      check((await page.getByRole('link', { name: 'Edit hole' }).count()) === 0, 'the crew can still edit a reviewed hole');
      await page.getByRole('link', { name: '← Test holes' }).click();
      await page.getByRole('button', { name: 'Filters' }).click();
      await page.getByLabel('Quality level').selectOption({ label: 'QL-B' });
      await page.getByText('Showing 1 of 15 holes').waitFor();
      await noSidewaysScroll(page, 'register');
      await page.screenshot({ path: join(shots, 'field-register-table-phone.png'), fullPage: true });
    },
  },
  {
    name: 'field register: a poor phone GPS fix is refused and a good one logs an approximate hole; a designer adds an unidentified line; a stale edit shows both values',
    allowErrors: [...SIGNED_OUT_PROBE, /409 \(Conflict\)/],
    async run({ page, baseUrl, shots }) {
      const context = page.context();
      const storm = road.lines.find((l) => l.key === 'storm-42')!;
      const [a, b] = [storm.path[0]!, storm.path[1]!];
      const grid: [number, number] = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
      // The phone's fix is given as WGS 84 longitude/latitude, made here from a grid point with the shared proj4 conversion.
      const [longitude, latitude] = gridToLonLat(projectCrs(road.project.crsCode, road.project.crsProj4), grid, { unit: road.project.unit });
      await context.grantPermissions(['geolocation'], { origin: baseUrl });
      try {
        await page.setViewportSize(PHONE);
        await openRoadHoles(page, baseUrl, 'field');
        await page.getByRole('link', { name: 'Log a test hole' }).click();
        await page.getByLabel('Hole number').fill('TH-92');
        await page.getByLabel('Line exposed').selectOption({ label: `${storm.label} (${LINE_KIND_LABELS[storm.kind]}, QL-${storm.qualityLevel})` });
        await page.getByLabel('Depth below ground').fill('7.10');
        await page.getByRole('group', { name: 'Position from' }).getByText('Phone GPS').click();

        // 50 m is 164.0 US ft, worse than the project's 16 US ft limit (seeds/demo/road-bore.ts).
        await context.setGeolocation({ latitude, longitude, accuracy: 50 });
        await page.getByRole('button', { name: 'Use my position' }).click();
        await page.getByText('±164.0 US ft (limit ±16.0 US ft)').waitFor({ timeout: 10_000 });
        await page.getByRole('button', { name: 'Stop and use the best fix' }).click();
        await page.getByRole('button', { name: 'Save test hole' }).click();
        await page.getByText(/±164\.0 US ft is worse than this project’s limit of ±16\.0 US ft/).first().waitFor();
        check((await page.getByRole('form', { name: 'Log a test hole' }).count()) === 1, 'a refused fix left the form');
        await page.screenshot({ path: join(shots, 'field-register-gps-refused-phone.png'), fullPage: true });

        check((await page.getByText('This position is far from the project').count()) === 0, 'a fix on the storm drain was called far from the project');

        // A good fix about 0.1° of latitude (some 11 km) north: the form says it is far from every line and bore.
        await context.setGeolocation({ latitude: latitude + 0.1, longitude, accuracy: 2 });
        await page.getByRole('button', { name: 'Try again' }).click();
        await page.getByText('This position is far from the project').waitFor({ timeout: 10_000 });

        // 2 m is 6.6 US ft: accepted, stored with its accuracy and flagged approximate; the phone's height is not asked for.
        await context.setGeolocation({ latitude, longitude, accuracy: 2 });
        await page.getByRole('button', { name: 'Try again' }).click();
        await page.getByText('±6.6 US ft (limit ±16.0 US ft)').waitFor({ timeout: 10_000 });
        await page.getByText('This position is far from the project').waitFor({ state: 'detached', timeout: 10_000 });
        await page.getByRole('button', { name: 'Save test hole' }).click();
        await page.getByRole('heading', { name: 'Test hole TH-92' }).waitFor({ timeout: 10_000 });
        const position = await page.getByLabel('Line and position').innerText();
        check(/phone GPS, ±6\.6 US ft/.test(position) && /approximate/.test(position), `the GPS position is not shown as approximate with its accuracy: ${position}`);
        check(/not surveyed yet/.test(position), 'a GPS position counts as surveyed');
        await signOut(page);
      } finally {
        await context.clearPermissions();
      }

      // A designer logs a hole on a line found on no record: the unidentified line is made with the hole, in one request.
      await page.setViewportSize(DESKTOP);
      await openRoadHoles(page, baseUrl, 'designer');
      await page.getByRole('link', { name: 'Log a test hole' }).click();
      await page.getByLabel('Hole number').fill('TH-91');
      await page.getByLabel('Line exposed').selectOption({ label: '+ New unidentified line (not on any record)' });
      const newLine = 'Unidentified 4-in steel pipe at TH-91';
      await page.getByLabel('New line name').fill(newLine);
      await page.getByLabel('Easting').fill(String(Math.round(grid[0] + 20)));
      await page.getByLabel('Northing').fill(String(Math.round(grid[1] + 6)));
      await page.getByLabel('Depth below ground').fill('5.20');
      await page.getByLabel('Measured size').fill('0.38');
      await page.getByRole('button', { name: 'Save test hole' }).click();
      await page.getByText(/Direction of run is needed to draw the new line/).first().waitFor();
      await page.getByLabel('Direction of run').fill('E-W');
      await page.screenshot({ path: join(shots, 'field-register-new-line-desktop.png'), fullPage: true });
      await page.getByRole('button', { name: 'Save test hole' }).click();
      await page.getByRole('heading', { name: 'Test hole TH-91' }).waitFor({ timeout: 10_000 });
      await page.getByLabel('Line and position').getByText(newLine).waitFor();
      await page.getByRole('link', { name: /^Lines/ }).getByText('11').waitFor();

      // Two tabs edit the same hole: the second save meets a stale version and shows both values.
      const editUrl = `${page.url()}/edit`;
      const other = await context.newPage();
      try {
        await page.goto(editUrl);
        await other.goto(editUrl);
        await other.getByLabel('Depth below ground').fill('5.30');
        await other.getByLabel('Material').fill('Steel, bare');
        await other.getByRole('button', { name: 'Save changes' }).click();
        await other.getByText('Changes saved.').waitFor({ timeout: 10_000 });
      } finally {
        await other.close();
      }
      await page.getByLabel('Depth below ground').fill('5.25');
      await page.getByLabel('Condition').fill('Rust scale on top');
      await page.getByRole('button', { name: 'Save changes' }).click();
      const panel = page.getByRole('region', { name: 'Resolve the edit conflict' });
      await panel.waitFor({ timeout: 10_000 });
      await panel.getByText('both of you changed it').waitFor();
      await panel.getByText('Material: — → Steel, bare').waitFor();
      const save = panel.getByRole('button', { name: 'Save with these choices' });
      check(await save.isDisabled(), 'the conflict can be saved before choosing a value for the depth both people changed');
      await page.screenshot({ path: join(shots, 'field-register-stale-desktop.png'), fullPage: true });
      await panel.getByLabel('Depth below ground: keep yours, 5.25 US ft').check();
      await save.click();
      await page.getByText('Changes saved.').waitFor({ timeout: 10_000 });
      const found = await page.getByLabel('Depth and elevation').innerText();
      const asFound = await page.getByLabel('The line as found').innerText();
      check(/5\.25 US ft/.test(found), `the chosen depth was not saved: ${found}`);
      check(/Steel, bare/.test(asFound) && /Rust scale on top/.test(asFound), `the other person's material or my condition was lost: ${asFound}`);
    },
  },
];
