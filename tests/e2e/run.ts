/**
 * Browser journeys: builds the client, starts the real server in-process on a free port with a
 * fresh database seeded with the demo, drives Debian's chromium headless, and prints
 * `N passed, N failed`. Screenshots go to tests/e2e/screenshots/ (not committed).
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createApp } from '../../server/app';
import { testConfig } from '../../server/config';
import { openDatabase } from '../../server/db';
import { seedDemo } from '../../server/seed/seeder';
import { DiskStorage } from '../../server/storage/storage';
import { startMail } from '../../server/modules/mail/mail-runtime';
import { ensureChromium, launchBrowser } from './browser';
import { JOURNEYS } from './journeys';

const chromiumPath = ensureChromium();
const root = process.cwd();
// Built into a folder of its own, so two test runs (or a running dev build) never collide.
const clientDir = mkdtempSync(join(tmpdir(), 'tl-e2e-dist-'));
console.log('Building the client…');
execFileSync(join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn', '--outDir', clientDir, '--emptyOutDir'], { stdio: 'inherit' });
/** E2E_ONLY=<text> runs only the journeys whose name contains the text. */
const only = process.env.E2E_ONLY;
const journeys = only ? JOURNEYS.filter((j) => j.name.includes(only)) : JOURNEYS;

const dataDir = mkdtempSync(join(tmpdir(), 'tl-e2e-'));
const config = testConfig({ dataDir, databasePath: join(dataDir, 'threadline.sqlite') });
const orm = await openDatabase(config.databasePath);
const storage = new DiskStorage(join(dataDir, 'files'));
await seedDemo(orm.em, storage);
// Mail as in development: the built-in catcher on loopback and the outbox worker (Admin → Mail shows what it caught).
const mail = await startMail({ ...config, mail: { ...config.mail, capture: true, workerIntervalSeconds: 1 } }, orm);
mail.worker.start();
const app = createApp({ orm, config, storage, clientDir, mail });
const server = app.listen(0, '127.0.0.1');
await new Promise<void>((resolve) => server.once('listening', () => resolve()));
const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
const shots = join(root, 'tests/e2e/screenshots');
mkdirSync(shots, { recursive: true });

const browser = await launchBrowser(chromiumPath);
let passed = 0;
let failed = 0;
try {
  for (const journey of journeys) {
    await browser.clearCookies(); // each journey starts signed out
    const page = await browser.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    page.on('request', (r) => {
      if (!r.url().startsWith(baseUrl) && !r.url().startsWith('data:') && !r.url().startsWith('blob:')) errors.push(`off-origin request: ${r.url()}`);
    });
    const started = Date.now();
    try {
      await journey.run({ page, baseUrl, shots });
      const unexpected = errors.filter((e) => !journey.allowErrors?.some((re) => re.test(e)));
      if (unexpected.length > 0) throw new Error(`browser errors:\n  ${unexpected.join('\n  ')}`);
      passed++;
      console.log(`  ✓ ${journey.name} (${Date.now() - started} ms)`);
    } catch (err) {
      failed++;
      console.log(`  ✗ ${journey.name}\n    ${(err as Error).message.split('\n').join('\n    ')}`);
      await page.screenshot({ path: join(shots, `failed-${journey.name.replace(/\W+/g, '-')}.png`), fullPage: true }).catch(() => undefined);
    } finally {
      await page.close();
    }
  }
} finally {
  await browser.close();
  server.close();
  await mail.close();
  await orm.close();
  rmSync(dataDir, { recursive: true, force: true });
  rmSync(clientDir, { recursive: true, force: true });
}
console.log(`\nbrowser: ${passed} passed, ${failed} failed`);
process.exit(failed === 0 && passed > 0 ? 0 : 1);
