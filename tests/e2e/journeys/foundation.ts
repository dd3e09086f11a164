import { join } from 'node:path';
import { DEMO_SCENARIOS, DEMO_USERS } from '../../../seeds/demo';
import { check, signIn, signOut, SIGNED_OUT_PROBE, type Journey } from './support';

export const FOUNDATION_JOURNEYS: Journey[] = [
  {
    name: 'the designer signs in on a desktop and sees both demo projects with their counts',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'designer');
      for (const s of DEMO_SCENARIOS) {
        await page.getByText(s.project.name).first().waitFor({ timeout: 10_000 });
      }
      const fontOk = await page.evaluate(() => document.fonts.check('16px "Inter Variable"'));
      check(fontOk, 'the bundled Inter font is not available');
      await page.screenshot({ path: join(shots, 'designer-projects-desktop.png'), fullPage: true });
    },
  },
  {
    name: 'a field crew signs in on a phone, opens the road project and sees the test holes with the digging cautions',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 390, height: 844 });
      await signIn(page, baseUrl, 'field');
      const road = DEMO_SCENARIOS[0]!;
      await page.getByText(road.project.name).first().click();
      await page.getByRole('link', { name: 'Test holes' }).first().click();
      const first = road.holes[0]!;
      await page.getByText(first.number, { exact: true }).first().waitFor({ timeout: 10_000 });
      await page.getByText(/one-call/i).first().waitFor();
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      check(overflow <= 1, `the page scrolls sideways on a phone by ${overflow}px`);
      await page.screenshot({ path: join(shots, 'field-holes-phone.png'), fullPage: true });
    },
  },
  {
    name: 'the administrator sees every demo user on the Users page; a reviewer sees no Users menu',
    allowErrors: SIGNED_OUT_PROBE,
    async run({ page, baseUrl, shots }) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await signIn(page, baseUrl, 'admin');
      await page.getByRole('link', { name: 'Users' }).first().click();
      for (const u of DEMO_USERS) await page.getByText(u.email).first().waitFor({ timeout: 10_000 });
      await page.screenshot({ path: join(shots, 'admin-users-desktop.png'), fullPage: true });
      // A CRS code from the built-in catalogue fills in its proj4 definition, unit and station style.
      // EPSG:26914 is NAD83 / UTM zone 14N, in metres (EPSG registry).
      await page.getByRole('link', { name: 'Projects', exact: true }).first().click();
      await page.getByRole('button', { name: 'New project' }).click();
      const form = page.getByRole('form', { name: 'New project' });
      await form.getByLabel('CRS code').fill('EPSG:26914');
      await form.getByRole('status').getByText(/EPSG:26914 .*filled in from the built-in catalogue/).waitFor({ timeout: 15_000 });
      check((await form.getByLabel('proj4 definition').inputValue()).includes('+proj=utm +zone=14'), 'the proj4 definition was not filled in');
      check((await form.getByLabel('Linear unit').inputValue()) === 'm', 'the unit was not set to metres');
      check((await form.getByLabel('Station style').inputValue()) === '1000', 'the station style was not set for metres');
      await form.getByRole('button', { name: 'Cancel' }).click();
      await signOut(page);
      await signIn(page, baseUrl, 'viewer');
      check((await page.getByRole('link', { name: 'Users' }).count()) === 0, 'a reviewer sees the Users menu');
    },
  },
];
