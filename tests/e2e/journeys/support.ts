/** Helpers shared by the browser journeys. */
import type { Page } from 'playwright-core';
import { DEMO_USERS } from '../../../seeds/demo';

export interface Journey {
  name: string;
  run(ctx: { page: Page; baseUrl: string; shots: string }): Promise<void>;
  /** Console errors that are expected (e.g. the 401 of /api/auth/me before signing in). */
  allowErrors?: RegExp[];
}

export const SIGNED_OUT_PROBE = [/401 \(Unauthorized\)/];

export function demoUser(role: string) {
  const user = DEMO_USERS.find((u) => u.role === role && u.active !== false);
  if (!user) throw new Error(`no demo user with role ${role}`);
  return user;
}

export async function signIn(page: Page, baseUrl: string, role: string): Promise<void> {
  const user = demoUser(role);
  await page.goto(`${baseUrl}/`);
  await page.getByLabel('Email').fill(user.email);
  await page.getByLabel('Password').fill(user.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByText(user.name).first().waitFor({ timeout: 10_000 });
}

export function check(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(message);
}

