/**
 * Field mode with no signal (issue 7), with Playwright's offline mode (context.setOffline):
 * two holes with photos logged offline and kept on the phone, the page reloaded offline (the
 * service worker serves the shell), the signal back and both holes arriving once; the same
 * outbox replayed twice without a duplicate; an edit made offline that meets someone else's
 * newer save, shown and resolved; a field crew logging a hole on a line on no record with no
 * signal, the hole and its new unidentified line arriving once. Holes, lines and photos are
 * counted through the API itself. The Test holes register lists the kept holes while offline,
 * marked as not sent and not linked, and each exactly once (the server's) after the signal returns.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Jimp } from 'jimp';
import type { Locator, Page } from 'playwright-core';
import type { HoleDto, LineDto, PhotoDto, ProjectDto } from '../../../shared/api';
import { LINE_KIND_LABELS } from '../../../shared/domain';
import { DEMO_SCENARIOS } from '../../../seeds/demo';
import { check, demoUser, signIn, SIGNED_OUT_PROBE, type Journey } from './support';

const PHONE = { width: 390, height: 844 };
const road = DEMO_SCENARIOS[0]!;
const HOLES = ['TH-71', 'TH-72'];
/** What the browser logs while the network is cut (failed fetches), expected here. */
const OFFLINE_ERRORS = [...SIGNED_OUT_PROBE, /ERR_INTERNET_DISCONNECTED/, /Failed to load resource/, /Failed to fetch/];

function gasMain(): { e: number; n: number; option: string } {
  const gas = road.lines.find((l) => l.key === 'gas-6')!;
  const [a, b] = [gas.path[0]!, gas.path[1]!];
  return { e: Math.round(((a[0] + b[0]) / 2) * 100) / 100, n: Math.round(((a[1] + b[1]) / 2) * 100) / 100, option: `${gas.label} (${LINE_KIND_LABELS[gas.kind]}, QL-${gas.qualityLevel})` };
}

async function png(shade: number): Promise<Buffer> {
  return new Jimp({ width: 40, height: 30, color: shade }).getBuffer('image/png');
}

/** Reads through Node's own fetch with a session of its own (the browser may be offline). */
async function apiSession(baseUrl: string, role: string) {
  const user = demoUser(role);
  const res = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: user.email, password: user.password }) });
  check(res.ok, `sign-in for the API reads failed: ${res.status}`);
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
  const call = async <T>(path: string, init: RequestInit = {}): Promise<T> => {
    const r = await fetch(`${baseUrl}${path}`, { ...init, headers: { ...(init.headers as Record<string, string>), Cookie: cookie, 'Content-Type': 'application/json' } });
    check(r.ok, `${init.method ?? 'GET'} ${path} answered ${r.status}`);
    return (await r.json()) as T;
  };
  return call;
}

async function roadProjectId(call: Awaited<ReturnType<typeof apiSession>>): Promise<number> {
  const projects = await call<ProjectDto[]>('/api/projects');
  const p = projects.find((x) => x.name === road.project.name);
  check(p, 'the road project is not listed');
  return p.id;
}

async function holesNamed(call: Awaited<ReturnType<typeof apiSession>>, projectId: number, number: string): Promise<HoleDto[]> {
  return (await call<HoleDto[]>(`/api/projects/${projectId}/holes`)).filter((h) => h.number === number);
}

/** The register's row of a hole, found by its row header (the hole number, then "not sent" on a kept one). */
function registerRows(page: Page, number: string): Locator {
  return page
    .getByRole('region', { name: 'Test holes' })
    .getByRole('row')
    .filter({ has: page.getByRole('rowheader', { name: new RegExp(`^${number}( not sent)?$`) }) });
}

const KEPT_BADGE = 'Kept on this phone — not sent';

async function unsentBadge(page: Page, text: string) {
  await page.getByRole('banner').getByRole('button', { name: text }).waitFor({ timeout: 20_000 });
}

async function logOffline(page: Page, number: string, at: { e: number; n: number; option: string }, photos: { name: string; buffer: Buffer }[]) {
  await page.getByRole('form', { name: 'Log a test hole' }).waitFor();
  await page.getByLabel('Hole number').fill(number);
  await page.getByLabel('Line exposed').selectOption({ label: at.option });
  await page.getByLabel('Easting').fill(String(at.e));
  await page.getByLabel('Northing').fill(String(at.n));
  await page.getByLabel('Depth below ground').fill('3.40');
  await page.getByLabel('Measured size').fill('0.55');
  await page.getByRole('button', { name: 'Save test hole' }).click();
  const kept = page.getByRole('region', { name: `Test hole ${number} on this phone` });
  await kept.getByText(`Test hole ${number} is kept on this phone`).waitFor({ timeout: 10_000 });
  await kept.getByLabel(`Add photos to ${number}`).setInputFiles(photos.map((p) => ({ ...p, mimeType: 'image/png' })));
  const list = kept.getByRole('list', { name: `Photos of ${number}` });
  await list.getByRole('listitem').nth(photos.length - 1).waitFor();
  check((await list.getByText('On this phone only').count()) === photos.length, `the photos of ${number} do not all say "On this phone only"`);
  check((await kept.getByText(/^Sent$/).count()) === 0, `something of ${number} says "Sent" while offline`);
}

export const OFFLINE_JOURNEYS: Journey[] = [
  {
    name: 'offline: two holes with photos logged with no signal survive a reload and arrive once when the signal returns',
    allowErrors: OFFLINE_ERRORS,
    async run({ page, baseUrl, shots }) {
      const context = page.context();
      const at = gasMain();
      const call = await apiSession(baseUrl, 'viewer');
      const projectId = await roadProjectId(call);
      await page.setViewportSize(PHONE);
      await signIn(page, baseUrl, 'field');
      // One visit online: the service worker installs and keeps the shell; the screens are read once.
      await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
      await page.goto(`${baseUrl}/projects/${projectId}/holes`);
      await page.getByRole('region', { name: 'Test holes' }).waitFor({ timeout: 10_000 });
      check((await page.getByText(KEPT_BADGE).count()) === 0, 'the register shows a kept hole before any was logged');
      await page.goto(`${baseUrl}/projects/${projectId}/holes/new`);
      await page.getByRole('form', { name: 'Log a test hole' }).waitFor({ timeout: 10_000 });
      check(await page.evaluate(() => navigator.serviceWorker.controller !== null), 'no service worker controls the page after the first visit');
      try {
        await context.setOffline(true);
        await logOffline(page, HOLES[0]!, at, [
          { name: 'th71-a.png', buffer: await png(0x336699ff) },
          { name: 'th71-b.png', buffer: await png(0x996633ff) },
        ]);
        await unsentBadge(page, '1 unsent');
        await page.getByRole('button', { name: 'Log another hole' }).click();
        await logOffline(page, HOLES[1]!, { ...at, e: at.e + 12 }, [{ name: 'th72-a.png', buffer: await png(0x669933ff) }]);
        await unsentBadge(page, '2 unsent');
        await page.screenshot({ path: join(shots, 'offline-kept-phone.png'), fullPage: true });

        // Reload with no signal: the shell comes from the service worker, the outbox from IndexedDB.
        await page.reload();
        await unsentBadge(page, '2 unsent');
        // The form opens with no signal: lines and bores come from the service worker's last reads.
        await page.getByRole('form', { name: 'Log a test hole' }).waitFor({ timeout: 15_000 });
        await page.getByRole('banner').getByRole('button', { name: '2 unsent' }).click();
        const outbox = page.getByRole('region', { name: 'Outbox' });
        for (const n of HOLES) await outbox.getByRole('listitem', { name: `Test hole ${n}` }).getByText('On this phone only').waitFor();
        await page.screenshot({ path: join(shots, 'offline-outbox-after-reload.png'), fullPage: true });
        for (const n of HOLES) check((await holesNamed(call, projectId, n)).length === 0, `${n} reached the server while the phone was offline`);

        // The Test holes register, opened with no signal, lists both kept holes: once each, marked
        // "not sent", with their photo count from the phone, and no link to a page the server lacks.
        await page.goto(`${baseUrl}/projects/${projectId}/holes`);
        await page.getByRole('region', { name: 'Test holes' }).waitFor({ timeout: 15_000 });
        for (const [i, n] of HOLES.entries()) {
          const row = registerRows(page, n);
          await row.getByText(KEPT_BADGE).waitFor({ timeout: 10_000 });
          check((await row.count()) === 1, `${n} is listed ${await row.count()} times in the register while offline`);
          check((await row.getByRole('link').count()) === 0, `the kept ${n} links to a hole page the server does not have`);
          const photos = (await row.getByRole('cell').last().innerText()).replace(/\s+/g, ' ').trim();
          check(photos === `${i === 0 ? 2 : 1} on this phone`, `the kept ${n} shows photos "${photos}"`);
        }
        await page.getByRole('group', { name: 'Filter by status' }).getByRole('button', { name: /^Kept on this phone\s*2$/ }).waitFor();
        await page.screenshot({ path: join(shots, 'offline-register-kept.png'), fullPage: true });

        // Signing out with unsent records warns, and "Export unsent" downloads them for the office.
        await page.getByRole('banner').getByRole('button', { name: 'Sign out' }).click();
        const warning = page.getByRole('alertdialog', { name: 'Unsent records' });
        await warning.getByText('2 records are on this phone only').waitFor();
        const [download] = await Promise.all([page.waitForEvent('download'), warning.getByRole('button', { name: 'Export unsent' }).click()]);
        const file = JSON.parse(readFileSync((await download.path())!, 'utf8')) as {
          holes: { number: string; crs: string; unit: string; verticalDatum: string; body: { clientId: string }; photos: { base64: string }[] }[];
        };
        check(file.holes.map((h) => h.number).join() === HOLES.join(), `the export lists ${file.holes.map((h) => h.number).join()}`);
        check(file.holes.every((h) => h.crs === 'EPSG:2278' && h.unit === 'usft' && h.verticalDatum === 'NAVD 88'), 'the export does not name the CRS, unit and datum of its values');
        // The photos read back as the images taken (jimp, a general-purpose image library).
        const back = await Jimp.read(Buffer.from(file.holes[0]!.photos[0]!.base64, 'base64'));
        check(back.width === 40 && back.height === 30, `an exported photo reads back as ${back.width}×${back.height}`);
        check(file.holes[0]!.photos.length === 2 && file.holes[1]!.photos.length === 1, 'the export does not carry every unsent photo');
        await warning.getByRole('button', { name: 'Stay signed in' }).click();
        check(await page.getByRole('banner').getByText(demoUser('field').name).isVisible(), 'staying signed in signed out');
      } finally {
        await context.setOffline(false);
      }
      // Signal back: the outbox sends by itself, oldest first. The register, watched meanwhile,
      // never lists a hole twice, and ends with each one once, the server's (linked, no badge).
      const deadline = Date.now() + 30_000;
      for (;;) {
        const counts = await Promise.all(HOLES.map((n) => registerRows(page, n).count()));
        check(counts.every((c) => c <= 1), `the register lists ${HOLES.map((n, i) => `${n} ${counts[i]}×`).join(', ')} while sending`);
        const links = await Promise.all(HOLES.map((n) => registerRows(page, n).getByRole('link', { name: n, exact: true }).count()));
        if (links.every((c) => c === 1) && (await page.getByText(KEPT_BADGE).count()) === 0) break;
        check(Date.now() < deadline, 'the sent holes did not replace the kept rows in the register within 30 s');
        await page.waitForTimeout(100);
      }
      for (const n of HOLES) check((await registerRows(page, n).count()) === 1, `${n} is not listed exactly once after sending`);
      await page.screenshot({ path: join(shots, 'offline-register-sent.png'), fullPage: true });
      await unsentBadge(page, 'All sent');
      await page.goto(`${baseUrl}/projects/${projectId}/holes/new`);
      await page.getByRole('form', { name: 'Log a test hole' }).waitFor({ timeout: 15_000 });
      await page.getByRole('banner').getByRole('button', { name: 'All sent' }).click();
      const outbox = page.getByRole('region', { name: 'Outbox' });
      for (const n of HOLES) await outbox.getByRole('listitem', { name: `Test hole ${n}` }).getByText('Sent', { exact: true }).waitFor();
      await page.screenshot({ path: join(shots, 'offline-all-sent.png'), fullPage: true });
      const [a] = await holesNamed(call, projectId, HOLES[0]!);
      const [b] = await holesNamed(call, projectId, HOLES[1]!);
      check(a && b, 'a hole kept offline did not arrive');
      check((await holesNamed(call, projectId, HOLES[0]!)).length === 1 && (await holesNamed(call, projectId, HOLES[1]!)).length === 1, 'a hole arrived twice');
      check(a.id < b.id, 'the holes did not arrive in the order they were made');
      const photosA = await call<PhotoDto[]>(`/api/projects/${projectId}/holes/${a.id}/photos`);
      const photosB = await call<PhotoDto[]>(`/api/projects/${projectId}/holes/${b.id}/photos`);
      check(photosA.length === 2 && photosB.length === 1, `photos arrived ${photosA.length} + ${photosB.length} times, expected 2 + 1`);
    },
  },
  {
    name: 'offline: the same outbox replayed twice makes no duplicate hole or photo',
    allowErrors: OFFLINE_ERRORS,
    async run({ page, baseUrl }) {
      const call = await apiSession(baseUrl, 'viewer');
      const projectId = await roadProjectId(call);
      await signIn(page, baseUrl, 'field');
      await page.getByRole('banner').getByRole('button', { name: 'All sent' }).waitFor({ timeout: 10_000 });
      for (let round = 1; round <= 2; round++) {
        // Forget every answer the phone had: holes unsent, photos of unknown fate (as after a lost reply).
        const reset = await page.evaluate(
          () =>
            new Promise<number>((resolve, reject) => {
              const open = indexedDB.open('threadline-outbox');
              open.onerror = () => reject(open.error);
              open.onsuccess = () => {
                const tx = open.result.transaction('holes', 'readwrite');
                const store = tx.objectStore('holes');
                const all = store.getAll();
                all.onsuccess = () => {
                  for (const h of all.result as { status: string; holeId?: number; photos: { status: string }[] }[]) {
                    h.status = 'local';
                    delete h.holeId;
                    for (const p of h.photos) p.status = 'sending';
                    store.put(h);
                  }
                  tx.oncomplete = () => resolve((all.result as unknown[]).length);
                };
              };
            }),
        );
        check(reset === 2, `the outbox holds ${reset} records, expected the 2 logged offline`);
        await page.reload();
        await page.getByRole('banner').getByRole('button', { name: 'All sent' }).waitFor({ timeout: 20_000 });
        for (const n of HOLES) {
          const found = await holesNamed(call, projectId, n);
          check(found.length === 1, `round ${round}: ${n} exists ${found.length} times`);
          const photos = await call<PhotoDto[]>(`/api/projects/${projectId}/holes/${found[0]!.id}/photos`);
          const expected = n === HOLES[0] ? 2 : 1;
          check(photos.length === expected, `round ${round}: ${n} has ${photos.length} photos, expected ${expected}`);
        }
      }
    },
  },
  {
    name: 'offline: an edit made with no signal that meets a newer save shows both values and is resolved',
    allowErrors: OFFLINE_ERRORS,
    async run({ page, baseUrl, shots }) {
      const context = page.context();
      const office = await apiSession(baseUrl, 'designer');
      const projectId = await roadProjectId(office);
      const [hole] = await holesNamed(office, projectId, HOLES[0]!);
      check(hole, `${HOLES[0]} is missing`);
      await page.setViewportSize(PHONE);
      await signIn(page, baseUrl, 'field');
      await page.goto(`${baseUrl}/projects/${projectId}/holes/${hole.id}/edit`);
      await page.getByRole('form', { name: `Edit test hole ${HOLES[0]}` }).waitFor({ timeout: 10_000 });
      try {
        await context.setOffline(true);
        await page.getByLabel('Depth below ground').fill('3.60');
        await page.getByRole('button', { name: 'Save changes' }).click();
        await page.getByText('Not sent: no connection').waitFor({ timeout: 10_000 });
        // Meanwhile the office changes the same depth.
        await office(`/api/projects/${projectId}/holes/${hole.id}`, { method: 'PATCH', body: JSON.stringify({ depthToTop: 3.75, version: hole.version }) });
      } finally {
        await context.setOffline(false);
      }
      await page.getByRole('button', { name: 'Save changes' }).click();
      const panel = page.getByRole('region', { name: 'Resolve the edit conflict' });
      await panel.waitFor({ timeout: 10_000 });
      await panel.getByText('both of you changed it').waitFor();
      await panel.getByText('3.75 US ft').waitFor();
      await page.screenshot({ path: join(shots, 'offline-collision.png'), fullPage: true });
      await panel.getByLabel('Depth below ground: keep yours, 3.60 US ft').check();
      await panel.getByRole('button', { name: 'Save with these choices' }).click();
      await page.getByText('Changes saved.').waitFor({ timeout: 10_000 });
      const [after] = await holesNamed(office, projectId, HOLES[0]!);
      check(after?.depthToTop === 3.6, `the chosen depth was not saved: ${after?.depthToTop}`);
    },
  },
  {
    name: 'offline: the service worker serves the app shell and the projects with no network',
    allowErrors: OFFLINE_ERRORS,
    async run({ page, baseUrl }) {
      const context = page.context();
      await signIn(page, baseUrl, 'field');
      await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
      await page.getByText(road.project.name).first().waitFor();
      try {
        await context.setOffline(true);
        await page.goto(`${baseUrl}/projects`);
        await page.getByRole('link', { name: 'Threadline' }).waitFor({ timeout: 10_000 });
        await page.getByText(road.project.name).first().waitFor({ timeout: 10_000 });
        const manifest = await page.evaluate(() => document.querySelector('link[rel="manifest"]')?.getAttribute('href'));
        check(manifest === '/manifest.webmanifest', `no web app manifest linked: ${manifest}`);
      } finally {
        await context.setOffline(false);
      }
    },
  },
  {
    name: 'offline: the office imports a phone\'s file of unsent records, twice, and the hole arrives once',
    allowErrors: OFFLINE_ERRORS,
    async run({ page, baseUrl, shots }) {
      const office = await apiSession(baseUrl, 'designer');
      const projectId = await roadProjectId(office);
      const lines = await office<{ id: number; label: string }[]>(`/api/projects/${projectId}/lines`);
      const gas = road.lines.find((l) => l.key === 'gas-6')!;
      const lineId = lines.find((l) => l.label === gas.label)!.id;
      const at = gasMain();
      // A file as "Export unsent" writes it (src/features/outbox/export-unsent.ts), from a lost phone.
      const file = {
        format: 'threadline-unsent-records',
        version: 1,
        exportedAt: new Date().toISOString(),
        holes: [
          {
            projectId, project: road.project.name, crs: road.project.crsCode, unit: road.project.unit, verticalDatum: road.project.verticalDatum,
            clientId: '7b0c8a52-4d1e-4c7a-9a35-3f0b2f6d9e11', number: 'TH-79', madeAt: new Date().toISOString(), status: 'local', reason: null, holeId: null,
            body: { clientId: '7b0c8a52-4d1e-4c7a-9a35-3f0b2f6d9e11', number: 'TH-79', lineId, positionSource: 'grid', easting: at.e, northing: at.n, depthToTop: 4.1 },
            photos: [{ name: 'th79.png', type: 'image/png', takenAt: '2026-12-01T15:00:00.000Z', caption: 'exposed', status: 'local', reason: null, base64: (await png(0x996633ff)).toString('base64') }],
          },
        ],
      };
      const buffer = Buffer.from(JSON.stringify(file));
      await signIn(page, baseUrl, 'designer');
      await page.goto(`${baseUrl}/projects/${projectId}/holes`);
      const input = page.getByLabel('Import unsent records (a file exported from a phone)');
      for (const expected of ['1 new here; 1 sent', '0 new here']) {
        await input.setInputFiles({ name: 'threadline-unsent.json', mimeType: 'application/json', buffer });
        await page.getByRole('status').filter({ hasText: expected }).waitFor({ timeout: 20_000 });
      }
      await page.screenshot({ path: join(shots, 'offline-office-import.png'), fullPage: true });
      const holes = await holesNamed(office, projectId, 'TH-79');
      check(holes.length === 1, `expected one TH-79, found ${holes.length}`);
      const photos = await office<PhotoDto[]>(`/api/projects/${projectId}/holes/${holes[0]!.id}/photos`);
      check(photos.length === 1, `expected one photo, found ${photos.length}`);
    },
  },
  {
    // Last of all: it adds a hole and a line, and the replay journey above counts the outbox's records.
    name: 'offline: a field crew logs a hole on a new unidentified line with no signal, and hole and line arrive once',
    allowErrors: OFFLINE_ERRORS,
    async run({ page, baseUrl, shots }) {
      const context = page.context();
      const call = await apiSession(baseUrl, 'viewer');
      const projectId = await roadProjectId(call);
      const number = 'TH-81';
      const label = 'Unidentified 8-in clay pipe at TH-81';
      const at = gasMain();
      await page.setViewportSize(PHONE);
      await signIn(page, baseUrl, 'field');
      // One visit online (also when this journey runs alone): the service worker keeps the shell and the lines.
      await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
      await page.goto(`${baseUrl}/projects/${projectId}/holes/new`);
      await page.getByRole('form', { name: 'Log a test hole' }).waitFor({ timeout: 10_000 });
      check(await page.evaluate(() => navigator.serviceWorker.controller !== null), 'no service worker controls the page after the first visit');
      try {
        await context.setOffline(true);
        await page.getByLabel('Hole number').fill(number);
        // Field crews are offered the new line too (it is made with the hole, by the hole create).
        await page.getByLabel('Line exposed').selectOption({ label: '+ New unidentified line (not on any record)' });
        await page.getByLabel('New line name').fill(label);
        await page.getByLabel('Easting').fill(String(at.e + 30));
        await page.getByLabel('Northing').fill(String(at.n));
        await page.getByLabel('Depth below ground').fill('2.90');
        await page.getByLabel('Measured size').fill('0.70');
        await page.getByLabel('Material').fill('Vitrified clay');
        await page.getByLabel('Direction of run').fill('N 83° E');
        await page.getByRole('button', { name: 'Save test hole' }).click();
        const kept = page.getByRole('region', { name: `Test hole ${number} on this phone` });
        await kept.getByText(`Test hole ${number} is kept on this phone`).waitFor({ timeout: 10_000 });
        await kept.getByLabel(`Add photos to ${number}`).setInputFiles([{ name: 'th81.png', mimeType: 'image/png', buffer: await png(0x884422ff) }]);
        await kept.getByRole('list', { name: `Photos of ${number}` }).getByRole('listitem').first().waitFor();
        await unsentBadge(page, '1 unsent');
        await page.screenshot({ path: join(shots, 'offline-new-line-kept.png'), fullPage: true });
        check((await holesNamed(call, projectId, number)).length === 0, `${number} reached the server while the phone was offline`);
        const linesOffline = await call<LineDto[]>(`/api/projects/${projectId}/lines`);
        check(!linesOffline.some((l) => l.label === label), 'the new line reached the server while the phone was offline');
      } finally {
        await context.setOffline(false);
      }
      await unsentBadge(page, 'All sent');
      const arrived = async (when: string) => {
        const holes = await holesNamed(call, projectId, number);
        check(holes.length === 1, `${when}: ${number} exists ${holes.length} times`);
        const lines = (await call<LineDto[]>(`/api/projects/${projectId}/lines`)).filter((l) => l.label === label);
        check(lines.length === 1, `${when}: the new line exists ${lines.length} times`);
        const line = lines[0]!;
        check(holes[0]!.lineId === line.id, `${when}: ${number} is not on the new line`);
        check(line.kind === 'unknown' && line.qualityLevel === 'A' && line.owner === 'Unknown' && line.diameter === 0.7, `${when}: the new line is ${line.kind}, QL-${line.qualityLevel}, ${line.owner}, ${line.diameter}`);
        const photos = await call<PhotoDto[]>(`/api/projects/${projectId}/holes/${holes[0]!.id}/photos`);
        check(photos.length === 1 && photos[0]!.clientId != null, `${when}: ${number} has ${photos.length} photos (expected 1, with its client id)`);
      };
      await arrived('after the signal returned');
      // The phone forgets the answers (as after lost replies) and sends everything again: still one of each.
      await page.evaluate(
        (n) =>
          new Promise<void>((resolve, reject) => {
            const open = indexedDB.open('threadline-outbox');
            open.onerror = () => reject(open.error);
            open.onsuccess = () => {
              const tx = open.result.transaction('holes', 'readwrite');
              const store = tx.objectStore('holes');
              const all = store.getAll();
              all.onsuccess = () => {
                for (const h of all.result as { number: string; status: string; holeId?: number; photos: { status: string }[] }[]) {
                  if (h.number !== n) continue;
                  h.status = 'local';
                  delete h.holeId;
                  for (const p of h.photos) p.status = 'sending';
                  store.put(h);
                }
                tx.oncomplete = () => resolve();
              };
            };
          }),
        number,
      );
      await page.reload();
      await unsentBadge(page, 'All sent');
      await page.getByRole('banner').getByRole('button', { name: 'All sent' }).click();
      await page.getByRole('region', { name: 'Outbox' }).getByRole('listitem', { name: `Test hole ${number}` }).getByText('Sent', { exact: true }).waitFor({ timeout: 20_000 });
      await unsentBadge(page, 'All sent');
      await arrived('after the outbox was sent again');
      await page.screenshot({ path: join(shots, 'offline-new-line-sent.png'), fullPage: true });
    },
  },
];
