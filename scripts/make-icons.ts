/**
 * Draws the app's install icons (public/icons/icon-192.png, icon-512.png, maskable-512.png) from
 * Threadline's own mark (src/app/layout/logo.tsx): two existing lines from above and a bore
 * threaded beneath them. Run with `npx tsx scripts/make-icons.ts`; the PNGs are committed.
 */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { Jimp } from 'jimp';

const BRAND = 0x1f4d53ff; // the theme colour in index.html
const LIGHT = 0xd9eef0ff;

async function draw(size: number, padding: number, file: string) {
  const img = new Jimp({ width: size, height: size, color: BRAND });
  // The mark is drawn on a 32-unit grid, scaled into the area inside the padding.
  const s = (size - 2 * padding) / 32;
  const at = (u: number) => padding + u * s;
  const disc = (cx: number, cy: number, r: number, color: number) => {
    for (let y = Math.floor(cy - r); y <= Math.ceil(cy + r); y++)
      for (let x = Math.floor(cx - r); x <= Math.ceil(cx + r); x++)
        if (x >= 0 && y >= 0 && x < size && y < size && (x - cx) ** 2 + (y - cy) ** 2 <= r * r) img.setPixelColor(color, x, y);
  };
  const r = 1.5 * s;
  // Two existing lines: M9 6v9, M23 6v9.
  for (const x of [9, 23]) for (let u = 6; u <= 15; u += 0.05) disc(at(x), at(u), r, 0x9fc9ceff);
  // The bore: M4 22 c5-4 9-4 12 0 s7 4 12 0, as two cubic Béziers.
  const cubic = (p0: number[], p1: number[], p2: number[], p3: number[]) => {
    for (let t = 0; t <= 1; t += 0.002) {
      const m = 1 - t;
      const x = m ** 3 * p0[0]! + 3 * m * m * t * p1[0]! + 3 * m * t * t * p2[0]! + t ** 3 * p3[0]!;
      const y = m ** 3 * p0[1]! + 3 * m * m * t * p1[1]! + 3 * m * t * t * p2[1]! + t ** 3 * p3[1]!;
      disc(at(x), at(y), r, LIGHT);
    }
  };
  cubic([4, 22], [9, 18], [13, 18], [16, 22]);
  cubic([16, 22], [19, 26], [23, 26], [28, 22]);
  await img.write(file as `${string}.png`);
}

const dir = join(process.cwd(), 'public/icons');
mkdirSync(dir, { recursive: true });
await draw(192, 16, join(dir, 'icon-192.png'));
await draw(512, 40, join(dir, 'icon-512.png'));
// Maskable: the mark inside the central safe zone (80 % circle).
await draw(512, 110, join(dir, 'maskable-512.png'));
console.log('icons written to public/icons');
