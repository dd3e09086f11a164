/**
 * Plan & profile (issue 5): the map over the project's own tiles, every demo line listed and
 * drawn, linked selection from the strip to the map and the table, live what-if on the bore
 * grade with cancel, the printed sheet read back with pdf-parse, and the phone layout.
 */
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import proj4 from 'proj4';
import { SphericalMercator } from '@mapbox/sphericalmercator';
import { PDFParse } from 'pdf-parse';
import { DEMO_SCENARIOS, ROAD_BORE_SCENARIO } from '../../../seeds/demo';
import { check, signIn, SIGNED_OUT_PROBE, type Journey } from './support';

async function openPlan(page: Page, projectName: string): Promise<void> {
  await page.getByRole('link', { name: 'Projects' }).first().click();
  await page.getByText(projectName).first().click();
  await page.getByRole('link', { name: 'Plan & profile' }).first().click();
  await page.getByTestId('profile-strip').waitFor({ timeout: 15_000 });
  await page.locator('[data-testid="plan-map"][data-tiles-loaded="true"]').waitFor({ timeout: 15_000 });
}

/** Line id (as the page knows it) of each demo line label, read from the table rows. */
async function lineIds(page: Page): Promise<Map<string, string>> {
  const rows = await page.locator('[data-testid="clearance-table"] tbody tr').evaluateAll((trs) =>
    trs.map((tr) => [tr.getAttribute('data-line-label') ?? '', tr.getAttribute('data-line-id') ?? ''] as const),
  );
  return new Map(rows);
}

async function statuses(page: Page): Promise<Record<string, string>> {
  const rows = await page.locator('[data-testid="clearance-table"] tbody tr').evaluateAll((trs) =>
    trs.map((tr) => [tr.getAttribute('data-line-id') ?? '', tr.getAttribute('data-status') ?? ''] as const),
  );
  return Object.fromEntries(rows);
}

export const PLAN_PROFILE_JOURNEYS: Journey[] = [
  {
    name: 'plan & profile: the designer opens each demo project and sees every line on the map, in the table and the local tiles',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      const tiles: { url: string; status: number }[] = [];
      page.on('response', (r) => {
        if (r.url().includes('/tiles/')) tiles.push({ url: r.url(), status: r.status() });
      });
      await signIn(page, baseUrl, 'designer');
      for (const s of DEMO_SCENARIOS) {
        await openPlan(page, s.project.name);
        const ids = await lineIds(page);
        for (const line of s.lines) {
          check(ids.has(line.label), `${s.key}: line "${line.label}" has no row in the table`);
          await page.getByTestId('clearance-table').getByText(line.label, { exact: true }).waitFor({ timeout: 2_000 });
        }
        const drawn = await page.getByTestId('plan-map').getAttribute('data-line-count');
        check(drawn === String(s.lines.length), `${s.key}: the map drew ${drawn} lines, the demo has ${s.lines.length}`);
        // every crossed line of the demo is drawn in the strip (the engine's report, not the intent, decides which)
        const inStrip = await page.locator('[data-testid="profile-strip"] [data-line-id]').count();
        check(inStrip >= s.lines.length - 3, `${s.key}: only ${inStrip} lines in the profile strip`);
        // the tile images the map shows came from this server and decoded as 256-px images
        await page.waitForTimeout(300);
        const images = await page.locator('.leaflet-tile-pane img.leaflet-tile-loaded').evaluateAll((imgs) =>
          (imgs as HTMLImageElement[]).map((i) => ({ w: i.naturalWidth, src: i.src })),
        );
        check(images.length > 0, `${s.key}: no base-map tile was shown`);
        check(images.every((i) => i.w === 256 && i.src.startsWith(baseUrl)), `${s.key}: a tile is not a 256-px image from this server`);
        // Leaflet's tile for the bore's first point is the one @mapbox/sphericalmercator (a reference
        // Web Mercator library) gives for that point, converted to lon/lat by proj4 on its own
        const addresses = images.map((i) => /\/tiles\/(\d+)\/(\d+)\/(\d+)\.png/.exec(i.src)!.slice(1).map(Number) as [number, number, number]);
        const z = addresses[0]![0];
        const start = s.bores[0]!.alignment[0]!;
        const [lon, lat] = proj4(s.project.crsProj4, 'WGS84').forward([start[0], start[1]]);
        const expected = new SphericalMercator({ size: 256 }).xyz([lon, lat, lon, lat], z);
        check(
          addresses.some(([tz, tx, ty]) => tz === z && tx === expected.minX && ty === expected.minY),
          `${s.key}: the tile ${z}/${expected.minX}/${expected.minY} holding the bore's first point is not on the map (${addresses.map((a) => a.join('/')).join(', ')})`,
        );
        await page.getByTestId('plan-legend').first().waitFor();
        await page.getByText(/Vertical exaggeration \d/).first().waitFor();
        await page.screenshot({ path: join(shots, `plan-${s.key}-desktop.png`), fullPage: true });
      }
      const bad = tiles.filter((t) => t.status !== 200 && t.status !== 304);
      check(bad.length === 0, `tile requests failed: ${bad.map((t) => `${t.status} ${t.url}`).join(', ')}`);
    },
  },
  {
    name: 'plan & profile: selecting a line in the profile strip selects it on the map and in the table, and back',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'designer');
      await openPlan(page, ROAD_BORE_SCENARIO.project.name);
      const ids = await lineIds(page);
      const storm = ids.get('42-in RCP storm trunk, south ditch')!;
      check(storm, 'the storm trunk is not in the table');
      await page.locator(`[data-testid="profile-strip"] [data-line-id="${storm}"]`).click();
      const map = page.getByTestId('plan-map');
      await page.waitForFunction((id) => {
        const el = document.querySelector('[data-testid="plan-map"]') as HTMLElement | null;
        return el?.dataset.selectedType === 'line' && el.dataset.selectedId === id;
      }, storm, { timeout: 5_000 });
      check((await page.locator(`[data-testid="clearance-table"] tr[data-line-id="${storm}"]`).getAttribute('aria-selected')) === 'true', 'the table row is not selected');
      await page.getByTestId('selection-card').getByText('42-in RCP storm trunk, south ditch').waitFor();
      await map.screenshot({ path: join(shots, 'plan-selected-on-map.png') });
      // and from the table to the strip and the map
      const sewer = ids.get('15-in gravity sanitary sewer, north shoulder')!;
      await page.locator(`[data-testid="clearance-table"] tr[data-line-id="${sewer}"] th button`).click();
      await page.waitForFunction((id) => (document.querySelector('[data-testid="plan-map"]') as HTMLElement | null)?.dataset.selectedId === id, sewer, { timeout: 5_000 });
      check(
        (await page.locator(`[data-testid="profile-strip"] [data-line-id="${sewer}"]`).getAttribute('data-selected')) === 'true',
        'the line chosen in the table is not selected in the strip',
      );
      // the measuring tool reads grid distance and a station on the bore
      await page.getByRole('button', { name: 'Measure' }).click();
      const box = (await map.boundingBox())!;
      await page.mouse.click(box.x + box.width * 0.45, box.y + box.height * 0.5);
      await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.55);
      const readout = await page.getByTestId('measure-readout').innerText();
      check(/Grid distance: [\d,.]+ US ft/.test(readout), `measuring readout: ${readout}`);
      check(/\d+\+\d\d\.\d\d, [\d.]+ US ft [LR]/.test(readout), `no station/offset in the readout: ${readout}`);
      check(/ellipsoid/.test(readout), 'no ellipsoidal distance in the readout');
      await map.screenshot({ path: join(shots, 'plan-measuring.png') });
    },
  },
  {
    name: 'plan & profile: changing the bore grade changes a status live, and cancel restores it',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'designer');
      await openPlan(page, ROAD_BORE_SCENARIO.project.name);
      const before = await statuses(page);
      await page.getByRole('button', { name: 'Edit bore profile' }).click();
      const grade = page.getByLabel('Grade', { exact: true });
      check((await grade.inputValue()) === '-0.500', `the grade field shows ${await grade.inputValue()}, the demo bore falls 0.5 %`);
      await grade.fill('-2.5');
      await page.waitForFunction(
        (was) => {
          const rows = [...document.querySelectorAll('[data-testid="clearance-table"] tbody tr')];
          return rows.some((tr) => was[tr.getAttribute('data-line-id') ?? ''] !== tr.getAttribute('data-status'));
        },
        before,
        { timeout: 5_000 },
      );
      const during = await statuses(page);
      const changed = Object.keys(before).filter((id) => before[id] !== during[id]);
      check(changed.length > 0, 'no status changed');
      await page.getByTestId('edit-summary').getByText('→').first().waitFor();
      check((await page.locator('[data-profile-point]').count()) === 2, 'the two profile points are not draggable in the strip');
      await page.screenshot({ path: join(shots, 'plan-editing-grade.png'), fullPage: true });
      await page.getByRole('button', { name: 'Cancel' }).click();
      await page.getByTestId('bore-editor').waitFor({ state: 'detached' });
      const after = await statuses(page);
      check(JSON.stringify(after) === JSON.stringify(before), `statuses not restored: ${JSON.stringify(after)} vs ${JSON.stringify(before)}`);
    },
  },
  {
    name: 'plan & profile: dragging a profile point in the strip moves the casing and the figures follow',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'designer');
      await openPlan(page, ROAD_BORE_SCENARIO.project.name);
      await page.getByRole('button', { name: 'Edit bore profile' }).click();
      const elevation = page.getByLabel('Elevation of profile point 2');
      const start = Number(await elevation.inputValue());
      const point = page.locator('[data-profile-point="1"]');
      await point.scrollIntoViewIfNeeded();
      const box = (await point.boundingBox())!;
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2 + 40, { steps: 5 });
      await page.mouse.up();
      await page.waitForTimeout(500);
      const now = Number(await elevation.inputValue());
      check(now < start - 0.5, `dragging the end point 40 px down moved its elevation from ${start} to ${now}`);
      await page.getByRole('button', { name: 'Cancel' }).click();
    },
  },
  {
    name: 'plan & profile: from the Bores tab, a saved grade change comes back from the server; a stale save shows both versions',
    allowErrors: [...SIGNED_OUT_PROBE, /409 \(Conflict\)/],
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'designer');
      await page.getByText(ROAD_BORE_SCENARIO.project.name).first().click();
      await page.getByRole('link', { name: 'Bores' }).first().click();
      await page.getByRole('link', { name: /^Edit .* with live clearances$/ }).first().click();
      await page.getByTestId('bore-editor').waitFor({ timeout: 15_000 });
      await page.locator('[data-testid="plan-map"][data-tiles-loaded="true"]').waitFor({ timeout: 15_000 });
      const original = await statuses(page);
      const grade = page.getByLabel('Grade', { exact: true });
      await grade.fill('-2.5');
      await page.getByTestId('edit-summary').getByText('→').first().waitFor();
      const live = await statuses(page);
      // a real save: the server recomputes the register, and the page shows its figures
      const saved = page.waitForResponse((r) => r.request().method() === 'PATCH' && /\/bores\/\d+$/.test(r.url()));
      await page.getByRole('button', { name: 'Save bore' }).click();
      check((await saved).status() === 200, 'the bore was not saved');
      await page.getByTestId('bore-editor').waitFor({ state: 'detached' });
      const fromServer = await statuses(page);
      check(JSON.stringify(fromServer) === JSON.stringify(live), `the server's statuses differ from the live ones: ${JSON.stringify(fromServer)} vs ${JSON.stringify(live)}`);
      // put the demo back as it was
      await page.getByRole('button', { name: 'Edit bore profile' }).click();
      await page.getByLabel('Grade', { exact: true }).fill('-0.5');
      await page.getByRole('button', { name: 'Save bore' }).click();
      await page.getByTestId('bore-editor').waitFor({ state: 'detached' });
      const restored = await statuses(page);
      check(JSON.stringify(restored) === JSON.stringify(original), `the demo was not restored: ${JSON.stringify(restored)}`);

      // someone else saved first (the server's answer is simulated, so the demo stays as it is)
      await page.getByRole('button', { name: 'Edit bore profile' }).click();
      await page.getByLabel('Grade', { exact: true }).fill('-1');
      await page.route(/\/api\/projects\/\d+\/bores\/\d+$/, async (route) => {
        if (route.request().method() !== 'PATCH') return route.continue();
        const bore = ROAD_BORE_SCENARIO.bores[0]!;
        const current = { ...bore, id: Number(route.request().url().split('/').pop()), version: 99, profile: [{ station: 1000, elevation: 415 }, { station: 1250, elevation: 414 }] };
        await route.fulfill({ status: 409, contentType: 'application/problem+json', body: JSON.stringify({ type: 'about:blank#stale_version', title: 'Conflict', status: 409, code: 'stale_version', detail: 'Someone else changed this record.', current }) });
      });
      await page.getByRole('button', { name: 'Save bore' }).click();
      const alert = page.getByText('Not saved: someone else saved this bore first');
      await alert.waitFor();
      await page.getByText(/Their profile: 10\+00\.00 @ 415\.00/).waitFor();
      await page.getByText(/Yours: 10\+00\.00 @ 417\.60/).waitFor();
      await page.screenshot({ path: join(shots, 'plan-stale-save.png'), fullPage: true });
      await page.unroute(/\/api\/projects\/\d+\/bores\/\d+$/);
      await page.getByRole('button', { name: 'Use their version' }).click();
      await page.getByTestId('bore-editor').waitFor({ state: 'detached' });
    },
  },
  {
    name: 'plan & profile: the printed sheet carries title, CRS, unit, datum, scale, north arrow and legend',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'viewer');
      await openPlan(page, ROAD_BORE_SCENARIO.project.name);
      check((await page.getByRole('button', { name: 'Edit bore profile' }).count()) === 0, 'a reviewer is offered bore editing');
      await page.emulateMedia({ media: 'print' });
      await page.waitForTimeout(300);
      await page.screenshot({ path: join(shots, 'plan-print-sheet.png'), fullPage: true });
      const pdf = await page.pdf({ format: 'Letter', landscape: true, printBackground: true });
      await page.emulateMedia({ media: 'screen' });
      // read the PDF back with pdf-parse, a general-purpose PDF reader
      const parser = new PDFParse({ data: new Uint8Array(pdf) });
      const text = (await parser.getText()).text;
      await parser.destroy();
      for (const needle of ['Plan and profile', ROAD_BORE_SCENARIO.bores[0]!.name, 'EPSG:2278', 'US survey feet', 'NAVD 88', 'Vertical exaggeration', 'US ft (grid)', 'true north', 'APWA', 'Clearances checked']) {
        check(text.toLowerCase().includes(needle.toLowerCase()), `the printed sheet lacks "${needle}": ${text.slice(0, 2500)}`);
      }
    },
  },
  {
    name: 'plan & profile: a field crew opens the creek project on a phone; map, strip and table fit the screen',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 390, height: 844 });
      await signIn(page, baseUrl, 'field');
      const creek = DEMO_SCENARIOS[1]!;
      await page.getByText(creek.project.name).first().click();
      await page.getByRole('link', { name: 'Plan & profile' }).first().click();
      await page.getByTestId('profile-strip').waitFor({ timeout: 15_000 });
      await page.locator('[data-testid="plan-map"][data-tiles-loaded="true"]').waitFor({ timeout: 15_000 });
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      const wide = overflow > 1 ? await page.evaluate(() =>
        [...document.querySelectorAll('body, body *')]
          .filter((el) => el.scrollWidth > window.innerWidth + 1 && getComputedStyle(el).overflowX === 'visible')
          .slice(0, 12)
          .map((el) => `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 50)} sw=${el.scrollWidth}`)
          .join('; ')) : '';
      check(overflow <= 1, `the page scrolls sideways on a phone by ${overflow}px: ${wide}`);
      check((await page.getByRole('button', { name: 'Edit bore profile' }).count()) === 0, 'a field crew is offered bore editing');
      await page.screenshot({ path: join(shots, 'plan-creek-phone.png'), fullPage: true });
    },
  },
];
