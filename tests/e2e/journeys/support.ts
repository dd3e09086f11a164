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

/**
 * Press "Sign out" and wait for the sign-in form. Signing out reads the phone's outbox before it
 * calls the server, so navigating away straight after the click can cancel the request and leave
 * the session alive; always wait here.
 */
export async function signOut(page: Page): Promise<void> {
  await page.getByRole('banner').getByRole('button', { name: 'Sign out' }).click();
  await page.getByLabel('Email').waitFor({ timeout: 30_000 }); // generous: the machines running CI are shared
}

/**
 * Sign in from the home page. The journeys share one browser profile, so a journey may start
 * with someone still signed in: that session is ended through the header first.
 */
export async function signIn(page: Page, baseUrl: string, role: string): Promise<void> {
  const user = demoUser(role);
  await page.goto(`${baseUrl}/`);
  const email = page.getByLabel('Email');
  const signOutButton = page.getByRole('banner').getByRole('button', { name: 'Sign out' });
  await email.or(signOutButton).first().waitFor({ timeout: 30_000 });
  if (await signOutButton.isVisible()) await signOut(page);
  await email.fill(user.email);
  await page.getByLabel('Password').fill(user.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByText(user.name).first().waitFor({ timeout: 10_000 });
}

export function check(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(message);
}

