/**
 * Plausible stand-in photos for the demo test holes, drawn with jimp: soil with noise, the
 * exposed line in its APWA marking colour, a marker post, or a patched pavement, stamped with
 * the hole number. Deterministic: the same options give the same JPEG bytes. No EXIF.
 */
import { Jimp, loadFont } from 'jimp';
import { SANS_16_WHITE, SANS_32_WHITE } from 'jimp/fonts';
import { LINE_KIND_COLOURS, type LineKind } from '@shared/domain';

export type DemoPhotoKind = 'exposed' | 'marker' | 'restored';

export interface DemoPhotoOptions {
  holeNumber: string;
  lineKind: LineKind;
  caption: string;
  kind: DemoPhotoKind;
  seed: number;
}

export const DEMO_PHOTO_WIDTH = 480;
export const DEMO_PHOTO_HEIGHT = 360;

type Rgb = [number, number, number];
type Font = Awaited<ReturnType<typeof loadFont>>;

let fonts: Promise<{ big: Font; small: Font } | null> | undefined;

/** jimp's bundled bitmap fonts (files inside node_modules, no network); null if they fail. */
function loadFonts(): Promise<{ big: Font; small: Font } | null> {
  fonts ??= Promise.all([loadFont(SANS_32_WHITE), loadFont(SANS_16_WHITE)])
    .then(([big, small]) => ({ big, small }))
    .catch(() => null);
  return fonts;
}

/** mulberry32: a small seeded generator, so every photo is reproducible. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function hexToRgb(hex: string): Rgb {
  const n = parseInt(hex.replace('#', ''), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

const clamp = (v: number) => (v < 0 ? 0 : v > 255 ? 255 : Math.round(v));

/** A raw RGBA canvas over jimp's bitmap, with the few shapes the photos need. */
class Canvas {
  constructor(
    readonly data: Buffer,
    readonly width: number,
    readonly height: number,
  ) {}

  set(x: number, y: number, c: Rgb, alpha = 1): void {
    if (x < 0 || y < 0 || x >= this.width || y >= this.height) return;
    const i = (Math.floor(y) * this.width + Math.floor(x)) * 4;
    const d = this.data;
    if (alpha >= 1) {
      d[i] = clamp(c[0]);
      d[i + 1] = clamp(c[1]);
      d[i + 2] = clamp(c[2]);
      d[i + 3] = 255;
      return;
    }
    d[i] = clamp(d[i]! * (1 - alpha) + c[0] * alpha);
    d[i + 1] = clamp(d[i + 1]! * (1 - alpha) + c[1] * alpha);
    d[i + 2] = clamp(d[i + 2]! * (1 - alpha) + c[2] * alpha);
    d[i + 3] = 255;
  }

  get(x: number, y: number): Rgb {
    const i = (y * this.width + x) * 4;
    return [this.data[i]!, this.data[i + 1]!, this.data[i + 2]!];
  }

  /** Fill the whole frame from a colour function of the pixel. */
  paint(fn: (x: number, y: number) => Rgb): void {
    for (let y = 0; y < this.height; y++) for (let x = 0; x < this.width; x++) this.set(x, y, fn(x, y));
  }

  rect(x0: number, y0: number, w: number, h: number, c: Rgb | ((x: number, y: number) => Rgb), alpha = 1): void {
    for (let y = Math.max(0, y0); y < Math.min(this.height, y0 + h); y++) {
      for (let x = Math.max(0, x0); x < Math.min(this.width, x0 + w); x++) this.set(x, y, typeof c === 'function' ? c(x, y) : c, alpha);
    }
  }

  ellipse(cx: number, cy: number, rx: number, ry: number, c: (x: number, y: number, r: number) => Rgb): void {
    for (let y = Math.max(0, Math.floor(cy - ry)); y <= Math.min(this.height - 1, cy + ry); y++) {
      for (let x = Math.max(0, Math.floor(cx - rx)); x <= Math.min(this.width - 1, cx + rx); x++) {
        const r = ((x - cx) / rx) ** 2 + ((y - cy) / ry) ** 2;
        if (r <= 1) this.set(x, y, c(x, y, r));
      }
    }
  }

  /** Irregular blob (clod, stone) of radius r. */
  blob(cx: number, cy: number, r: number, c: Rgb, rnd: () => number): void {
    const k = 0.6 + rnd() * 0.8;
    this.ellipse(cx, cy, r * k, r / k, (_x, _y, rr) => {
      const shade = 1 - rr * 0.25;
      return [c[0] * shade, c[1] * shade, c[2] * shade];
    });
  }
}

/** Soil colours: clay, loam, sandy loam, caliche-streaked. */
const SOILS: Rgb[] = [
  [122, 86, 58],
  [98, 74, 52],
  [141, 110, 78],
  [132, 104, 80],
];

function drawSoil(cv: Canvas, rnd: () => number, depthDarkening = 0): void {
  const base = SOILS[Math.floor(rnd() * SOILS.length)]!;
  // coarse value noise on a 16-px lattice plus fine per-pixel grain
  const gw = Math.ceil(cv.width / 16) + 2;
  const gh = Math.ceil(cv.height / 16) + 2;
  const lattice = Array.from({ length: gw * gh }, () => rnd() * 2 - 1);
  const coarse = (x: number, y: number) => {
    const gx = x / 16;
    const gy = y / 16;
    const x0 = Math.floor(gx);
    const y0 = Math.floor(gy);
    const fx = gx - x0;
    const fy = gy - y0;
    const i = y0 * gw + x0;
    return (lattice[i]! * (1 - fx) + lattice[i + 1]! * fx) * (1 - fy) + (lattice[i + gw]! * (1 - fx) + lattice[i + gw + 1]! * fx) * fy;
  };
  cv.paint((x, y) => {
    const n = coarse(x, y) * 18 + (rnd() * 2 - 1) * 14;
    const dark = 1 - depthDarkening * (y / cv.height);
    return [(base[0] + n) * dark, (base[1] + n * 0.8) * dark, (base[2] + n * 0.6) * dark];
  });
  for (let i = 0; i < 90; i++) {
    const shade = 0.7 + rnd() * 0.25;
    cv.blob(rnd() * cv.width, rnd() * cv.height, 2 + rnd() * 6, [base[0] * shade, base[1] * shade, base[2] * shade], rnd);
  }
  for (let i = 0; i < 90; i++) {
    const g = 120 + rnd() * 90;
    cv.blob(rnd() * cv.width, rnd() * cv.height, 1.5 + rnd() * 3.5, [g, g * 0.97, g * 0.92], rnd);
  }
}

function drawExposed(cv: Canvas, rnd: () => number, colour: Rgb): void {
  drawSoil(cv, rnd);
  // the vacuum-excavated hole, darker and wetter towards the bottom
  const cx = cv.width / 2 + (rnd() - 0.5) * 40;
  const cy = cv.height / 2 + 20;
  const rx = 190;
  const ry = 170;
  cv.ellipse(cx, cy, rx, ry, (x, y, r) => {
    const [R, G, B] = cv.get(x, y);
    const f = 0.45 + 0.25 * r;
    return [R * f, G * f, B * f];
  });
  // the exposed line: a band across the bottom of the hole, shaded like a cylinder
  const top = cy + 10 + rnd() * 20;
  const h = 56 + rnd() * 30;
  const tilt = (rnd() - 0.5) * 0.25;
  for (let x = Math.floor(cx - rx); x <= cx + rx; x++) {
    const t0 = top + (x - cx) * tilt;
    for (let y = Math.floor(t0); y < t0 + h; y++) {
      const r = ((x - cx) / rx) ** 2 + ((y - cy) / ry) ** 2;
      if (r > 0.92) continue;
      const a = ((y - t0) / h) * Math.PI - Math.PI / 2; // -90° top .. +90° bottom
      const light = 0.55 + 0.55 * Math.cos(a + 0.5) + (rnd() - 0.5) * 0.06;
      cv.set(x, y, [colour[0] * light + 20 * (1 - light), colour[1] * light + 20 * (1 - light), colour[2] * light + 20 * (1 - light)]);
    }
  }
  // a tape measure down to the top of the line, yellow with black ticks
  const tx = Math.floor(cx - 40 + rnd() * 80);
  const ty0 = Math.floor(cy - ry - 40);
  const ty1 = Math.floor(top + (tx - cx) * tilt);
  cv.rect(tx, ty0, 14, ty1 - ty0, [232, 200, 40]);
  for (let y = ty0; y < ty1; y += 8) cv.rect(tx, y, (y - ty0) % 40 === 0 ? 12 : 6, 2, [20, 20, 20]);
}

function drawMarker(cv: Canvas, rnd: () => number, colour: Rgb): void {
  drawSoil(cv, rnd);
  // tufts of grass
  for (let i = 0; i < 2500; i++) {
    const x = rnd() * cv.width;
    const y = rnd() * cv.height;
    const len = 4 + rnd() * 10;
    const g: Rgb = [60 + rnd() * 40, 110 + rnd() * 60, 40 + rnd() * 30];
    for (let k = 0; k < len; k++) cv.set(x + k * 0.3, y - k, g, 0.8);
  }
  // painted locate mark across the ground, slightly ragged
  const y0 = 330 + rnd() * 40;
  for (let x = 40; x < cv.width - 40; x++) {
    const w = 14 + Math.sin(x / 23) * 3 + rnd() * 3;
    for (let y = y0 - w / 2; y < y0 + w / 2; y++) if (rnd() > 0.12) cv.set(x, y + (x - 40) * 0.05, colour, 0.85);
  }
  // marker post (wooden lath) with a flag in the line's colour
  const px = Math.floor(cv.width / 2 + (rnd() - 0.5) * 120);
  cv.rect(px + 6, 130, 24, 300, [40, 30, 20], 0.35); // shadow
  cv.rect(px, 110, 22, 300, (x, y) => {
    const grain = Math.sin(y / 3 + x) * 8 + (rnd() - 0.5) * 10;
    return [196 + grain, 160 + grain, 110 + grain];
  });
  cv.rect(px, 110, 22, 70, colour);
  for (let y = 110; y < 170; y++) {
    const w = ((170 - y) / 60) * 70;
    cv.rect(px + 22, y, Math.floor(w), 1, colour, 0.9);
  }
}

function drawRestored(cv: Canvas, rnd: () => number): void {
  // pavement: grey asphalt with aggregate, and a darker fresh patch with sealed edges
  cv.paint(() => {
    const g = 112 + (rnd() * 2 - 1) * 16;
    return [g, g, g + 3];
  });
  for (let i = 0; i < 1400; i++) {
    const g = 140 + rnd() * 70;
    cv.blob(rnd() * cv.width, rnd() * cv.height, 1 + rnd() * 2.2, [g, g * 0.98, g * 0.95], rnd);
  }
  const w = 220 + rnd() * 60;
  const h = 180 + rnd() * 50;
  const x0 = Math.floor((cv.width - w) / 2 + (rnd() - 0.5) * 60);
  const y0 = Math.floor((cv.height - h) / 2 + (rnd() - 0.5) * 40);
  cv.rect(x0, y0, Math.floor(w), Math.floor(h), () => {
    const g = 58 + (rnd() * 2 - 1) * 10;
    return [g, g, g + 2];
  });
  // tack-coat seam around the patch
  cv.rect(x0 - 3, y0 - 3, Math.floor(w) + 6, 3, [34, 34, 36]);
  cv.rect(x0 - 3, y0 + Math.floor(h), Math.floor(w) + 6, 3, [34, 34, 36]);
  cv.rect(x0 - 3, y0, 3, Math.floor(h), [34, 34, 36]);
  cv.rect(x0 + Math.floor(w), y0, 3, Math.floor(h), [34, 34, 36]);
  // a lane line crossing the frame
  cv.rect(0, Math.floor(y0 + h + 40), cv.width, 12, [226, 222, 210], 0.9);
}

/** Unpaved restoration: raked topsoil with straw mulch and a few seedlings. */
function drawSeeded(cv: Canvas, rnd: () => number): void {
  drawSoil(cv, rnd, 0.25);
  for (let i = 0; i < 1800; i++) {
    const x = rnd() * cv.width;
    const y = rnd() * cv.height;
    const len = 6 + rnd() * 14;
    const a = rnd() * Math.PI;
    const c: Rgb = [214 + rnd() * 30, 186 + rnd() * 30, 110 + rnd() * 30];
    for (let k = 0; k < len; k++) cv.set(x + Math.cos(a) * k, y + Math.sin(a) * k, c, 0.85);
  }
  for (let i = 0; i < 600; i++) {
    const x = rnd() * cv.width;
    const y = rnd() * cv.height;
    for (let k = 0; k < 4; k++) cv.set(x, y - k, [70, 150 + rnd() * 40, 50], 0.9);
  }
}

/**
 * A small JPEG (480 × 360) standing in for a field photo of a test hole. 'restored' shows
 * patched pavement, or seeded topsoil when the caption speaks of seed, sod or topsoil.
 */
export async function makeDemoPhoto(opts: DemoPhotoOptions): Promise<Buffer> {
  const data = Buffer.alloc(DEMO_PHOTO_WIDTH * DEMO_PHOTO_HEIGHT * 4);
  const cv = new Canvas(data, DEMO_PHOTO_WIDTH, DEMO_PHOTO_HEIGHT);
  const rnd = random(opts.seed * 2654435761 + opts.kind.length);
  const colour = hexToRgb(LINE_KIND_COLOURS[opts.lineKind]);
  if (opts.kind === 'exposed') drawExposed(cv, rnd, colour);
  else if (opts.kind === 'marker') drawMarker(cv, rnd, colour);
  else if (/\b(seed|seeded|sod|topsoil|grass)\b/i.test(opts.caption)) drawSeeded(cv, rnd);
  else drawRestored(cv, rnd);

  const f = await loadFonts();
  if (f) {
    // dark bands for the hole number (top left) and the caption (bottom)
    cv.rect(0, 0, 24 + opts.holeNumber.length * 20, 52, [0, 0, 0], 0.55);
    cv.rect(0, DEMO_PHOTO_HEIGHT - 30, DEMO_PHOTO_WIDTH, 30, [0, 0, 0], 0.55);
  }
  const image = Jimp.fromBitmap({ data, width: DEMO_PHOTO_WIDTH, height: DEMO_PHOTO_HEIGHT });
  if (f) {
    image.print({ font: f.big, x: 12, y: 8, text: opts.holeNumber });
    image.print({ font: f.small, x: 10, y: DEMO_PHOTO_HEIGHT - 25, text: truncate(opts.caption, 74) });
  }
  return image.getBuffer('image/jpeg', { quality: 82 });
}

function truncate(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, max - 3)}...`;
}
