import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

const CANDIDATES = ['/usr/bin/chromium', '/usr/bin/chromium-browser'];

/**
 * Find Debian's chromium; install it with apt-get when running as root, else stop with a
 * message naming the package.
 */
export function ensureChromium(): string {
  const found = CANDIDATES.find((p) => existsSync(p));
  if (found) return found;
  if (process.getuid?.() === 0) {
    console.log('chromium is missing: installing Debian package "chromium" with apt-get…');
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
    execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    const installed = CANDIDATES.find((p) => existsSync(p));
    if (installed) return installed;
  }
  console.error('The browser tests need Debian\'s "chromium" package. Install it with: sudo apt-get install chromium');
  process.exit(2);
}

/** A headless chromium with a fresh profile and no background network traffic. */
export async function launchBrowser(executablePath: string): Promise<BrowserContext> {
  return chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'tl-pw-')), {
    executablePath,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}
