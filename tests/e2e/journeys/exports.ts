/**
 * Exports and imports (issue 6, items 3 and 5): the manager exports the conflict list as CSV;
 * a reviewer prepares the project zip, watches its progress and downloads it; a design engineer
 * imports lines from a CSV point file on the Lines tab (file → preview → mapping → import).
 * Downloads are read back with papaparse and jszip.
 */
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import JSZip from 'jszip';
import Papa from 'papaparse';
import type { Page } from 'playwright-core';
import { DEMO_SCENARIOS } from '../../../seeds/demo';
import { check, signIn, SIGNED_OUT_PROBE, type Journey } from './support';

const road = DEMO_SCENARIOS[0]!;
const creek = DEMO_SCENARIOS[1]!;

/** Open a tab of a project from wherever the person landed. */
async function openTab(page: Page, projectName: string, tab: string) {
  await page.getByRole('link', { name: 'Projects', exact: true }).first().click();
  await page.getByRole('link', { name: projectName }).first().click();
  await page.getByRole('link', { name: tab, exact: true }).first().click();
  await page.getByRole('heading', { name: tab, exact: true }).waitFor({ timeout: 15_000 });
}

export const EXPORT_JOURNEYS: Journey[] = [
  {
    name: 'exports: the manager exports the conflict list as CSV with its header block',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 900 });
      await signIn(page, baseUrl, 'manager');
      await openTab(page, road.project.name, 'Exports');
      await page.getByText(/The exports hold everything/).waitFor({ timeout: 15_000 });
      await page.screenshot({ path: join(shots, 'exports-manager-desktop.png'), fullPage: true });
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Conflict list CSV' }).click()]);
      const name = download.suggestedFilename();
      check(/^tallowmere-parkway-[a-z0-9-]*-conflicts-\d{8}-\d{4}\.csv$/.test(name), `unexpected file name ${name}`);
      const path = await download.path();
      const csv = readFileSync(path, 'utf8');
      check(csv.includes('# CRS: EPSG:2278'), 'the CSV header block names no CRS');
      check(csv.includes('# Vertical datum: NAVD 88'), 'the CSV header block names no vertical datum');
      check(/# Clearances checked: \d{4}-\d\d-\d\dT/.test(csv), 'the CSV header block has no clearance check time');
      const rows = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true }).data;
      check(rows.length > 0 && rows.every((r) => /^C-\d+$/.test(r.Conflict ?? '')), `the CSV rows do not read back (${rows.length} rows)`);
    },
  },
  {
    name: 'exports: a reviewer prepares the project zip, sees its progress and downloads it',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 390, height: 844 });
      await signIn(page, baseUrl, 'viewer');
      await openTab(page, road.project.name, 'Exports');
      await page.getByRole('button', { name: 'Prepare zip' }).click();
      await page.getByRole('progressbar', { name: 'Zip progress' }).waitFor({ timeout: 15_000 });
      const link = page.getByRole('link', { name: 'Download zip' });
      await link.waitFor({ timeout: 60_000 });
      await link.scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(shots, 'exports-viewer-zip-phone.png'), fullPage: true });
      const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
      const name = download.suggestedFilename();
      check(/-export-\d{8}-\d{4}\.zip$/.test(name), `unexpected zip name ${name}`);
      const path = await download.path();
      const size = statSync(path).size;
      check(size > 0, 'the zip is empty');
      const zip = await JSZip.loadAsync(readFileSync(path));
      const files = Object.keys(zip.files);
      check(files.includes('README.txt'), 'the zip has no README.txt');
      check(files.some((f) => /^photos\/TH-\d+_\d+\.jpg$/.test(f)), `the zip has no photos named by hole number (${files.join(', ')})`);
      const readme = await zip.file('README.txt')!.async('string');
      check(readme.includes('Vertical datum:      NAVD 88'), 'the README names no vertical datum');
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      check(overflow <= 1, `the Exports tab scrolls sideways on a phone by ${overflow}px`);
    },
  },
  {
    name: 'imports: a design engineer imports lines from a CSV point file on the Lines tab',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 900 });
      await signIn(page, baseUrl, 'designer');
      await openTab(page, creek.project.name, 'Lines');
      await page.getByRole('button', { name: 'Import lines…' }).click();
      // Two lines across the creek bore's alignment (EPSG:26914, metres), by code; and a row that is not a number.
      const bad = ['point,northing,easting,elevation,description', '1,3243480,645850,,FO-NEW fibre', '2,3243540,645852,,FO-NEW', '3,north,645900,,GM-NEW gas'].join('\n');
      await page.getByLabel('Line file').setInputFiles({ name: 'new-lines.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
      await page.getByLabel('Kind for FO-NEW').waitFor({ timeout: 15_000 });
      await page.getByLabel('Kind for FO-NEW').selectOption('communications');
      await page.getByLabel('Default owner').fill('Quarrow Fibre Co-op');
      await page.getByLabel('Default outside diameter (m)').fill('0.1');
      await page.getByLabel('Record depth to top (m)').fill('1.2');
      await page.getByRole('button', { name: 'Check the import' }).click();
      await page.getByText('row 4: northing "north" is not a number').waitFor({ timeout: 15_000 });
      await page.screenshot({ path: join(shots, 'imports-designer-problem.png'), fullPage: true });

      const good = ['point,northing,easting,elevation,description', '1,3243480,645850,,FO-NEW fibre', '2,3243540,645852,,FO-NEW', '3,3243480,645900,,GM-NEW gas', '4,3243540,645903,,GM-NEW'].join('\n');
      await page.getByLabel('Line file').setInputFiles({ name: 'new-lines.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
      await page.getByLabel('Kind for GM-NEW').waitFor({ timeout: 15_000 });
      await page.getByLabel('Kind for FO-NEW').selectOption('communications');
      await page.getByLabel('Kind for GM-NEW').selectOption('gas');
      await page.getByLabel('Owner for GM-NEW').fill('Quarrow Gas');
      await page.getByRole('button', { name: 'Check the import' }).click();
      await page.getByRole('button', { name: 'Import 2 lines' }).click();
      await page.getByText('2 lines imported').waitFor({ timeout: 15_000 });
      await page.getByRole('cell', { name: 'GM-NEW' }).or(page.getByText('GM-NEW', { exact: true })).first().waitFor({ timeout: 15_000 });
      await page.screenshot({ path: join(shots, 'imports-designer-done.png'), fullPage: true });
    },
  },
];
