/**
 * Test photos with a hand-made EXIF block. jimp writes no EXIF (../shared/STACK.md §6), so the
 * JPEG is jimp's output with an APP1 segment spliced in after the SOI marker. The layout follows
 * the EXIF 2.32 / TIFF 6.0 specifications (CIPA DC-008, Adobe TIFF 6.0): a big-endian TIFF
 * header, IFD0 with Orientation (0x0112) and pointers to the Exif IFD (0x8769) and GPS IFD
 * (0x8825), DateTimeOriginal (0x9003) with OffsetTimeOriginal (0x9011), and the GPS latitude and
 * longitude as three RATIONALs (degrees, minutes, seconds) with their N/S and E/W references.
 */
import { Jimp } from 'jimp';

type Entry = { tag: number; type: 2 | 3 | 4 | 5; count: number; data: Buffer } | { tag: number; type: 4; pointer: string };

const TYPE_SIZE = { 2: 1, 3: 2, 4: 4, 5: 8 } as const;

function ascii(text: string): Buffer {
  return Buffer.from(`${text}\0`, 'latin1');
}

function short(v: number): Buffer {
  const b = Buffer.alloc(2);
  b.writeUInt16BE(v);
  return b;
}

function rationals(values: [number, number][]): Buffer {
  const b = Buffer.alloc(8 * values.length);
  values.forEach(([n, d], i) => {
    b.writeUInt32BE(n, i * 8);
    b.writeUInt32BE(d, i * 8 + 4);
  });
  return b;
}

/** Lay out named IFDs one after another, each followed by its out-of-line values. */
function tiff(ifds: { name: string; entries: Entry[] }[]): Buffer {
  const offsets = new Map<string, number>();
  let at = 8;
  for (const ifd of ifds) {
    offsets.set(ifd.name, at);
    const extra = ifd.entries.reduce((n, e) => n + ('data' in e && e.data.length > 4 ? e.data.length + (e.data.length % 2) : 0), 0);
    at += 2 + ifd.entries.length * 12 + 4 + extra;
  }
  const out = Buffer.alloc(at);
  out.write('MM', 0, 'latin1');
  out.writeUInt16BE(42, 2);
  out.writeUInt32BE(8, 4);
  for (const ifd of ifds) {
    const start = offsets.get(ifd.name)!;
    const entries = [...ifd.entries].sort((a, b) => a.tag - b.tag);
    out.writeUInt16BE(entries.length, start);
    let dataAt = start + 2 + entries.length * 12 + 4;
    entries.forEach((e, i) => {
      const p = start + 2 + i * 12;
      out.writeUInt16BE(e.tag, p);
      out.writeUInt16BE(e.type, p + 2);
      if ('pointer' in e) {
        out.writeUInt32BE(1, p + 4);
        out.writeUInt32BE(offsets.get(e.pointer)!, p + 8);
        return;
      }
      out.writeUInt32BE(e.count, p + 4);
      if (e.data.length !== e.count * TYPE_SIZE[e.type]) throw new Error(`tag ${e.tag}: count does not match data`);
      if (e.data.length <= 4) {
        e.data.copy(out, p + 8);
      } else {
        out.writeUInt32BE(dataAt, p + 8);
        e.data.copy(out, dataAt);
        dataAt += e.data.length + (e.data.length % 2);
      }
    });
    out.writeUInt32BE(0, start + 2 + entries.length * 12);
  }
  return out;
}

export interface ExifOptions {
  orientation?: number;
  /** Decimal degrees, north positive. */
  latitude?: number;
  /** Decimal degrees, east positive. */
  longitude?: number;
  /** `YYYY:MM:DD HH:MM:SS` as cameras write it, with its offset, e.g. `+02:00`. */
  dateTimeOriginal?: string;
  offsetTimeOriginal?: string;
}

/** Degrees → [deg, min, sec×1000/1000] rationals. */
function dms(value: number): [number, number][] {
  const v = Math.abs(value);
  const deg = Math.floor(v);
  const minFloat = (v - deg) * 60;
  const min = Math.floor(minFloat);
  const sec = Math.round((minFloat - min) * 60 * 1000);
  return [
    [deg, 1],
    [min, 1],
    [sec, 1000],
  ];
}

/** The APP1 segment (marker, length, `Exif\0\0`, TIFF) for the options given. */
export function exifSegment(o: ExifOptions): Buffer {
  const ifd0: Entry[] = [];
  const exif: Entry[] = [];
  const gps: Entry[] = [];
  if (o.orientation !== undefined) ifd0.push({ tag: 0x0112, type: 3, count: 1, data: short(o.orientation) });
  if (o.dateTimeOriginal) exif.push({ tag: 0x9003, type: 2, count: 20, data: ascii(o.dateTimeOriginal) });
  if (o.offsetTimeOriginal) exif.push({ tag: 0x9011, type: 2, count: 7, data: ascii(o.offsetTimeOriginal) });
  if (o.latitude !== undefined && o.longitude !== undefined) {
    gps.push({ tag: 0x0001, type: 2, count: 2, data: ascii(o.latitude >= 0 ? 'N' : 'S') });
    gps.push({ tag: 0x0002, type: 5, count: 3, data: rationals(dms(o.latitude)) });
    gps.push({ tag: 0x0003, type: 2, count: 2, data: ascii(o.longitude >= 0 ? 'E' : 'W') });
    gps.push({ tag: 0x0004, type: 5, count: 3, data: rationals(dms(o.longitude)) });
  }
  if (exif.length) ifd0.push({ tag: 0x8769, type: 4, pointer: 'exif' });
  if (gps.length) ifd0.push({ tag: 0x8825, type: 4, pointer: 'gps' });
  const ifds = [{ name: 'ifd0', entries: ifd0 }];
  if (exif.length) ifds.push({ name: 'exif', entries: exif });
  if (gps.length) ifds.push({ name: 'gps', entries: gps });
  const body = Buffer.concat([Buffer.from('Exif\0\0', 'latin1'), tiff(ifds)]);
  const header = Buffer.alloc(4);
  header.writeUInt16BE(0xffe1, 0);
  header.writeUInt16BE(body.length + 2, 2);
  return Buffer.concat([header, body]);
}

/** Insert an APP1 EXIF segment right after a JPEG's SOI marker. */
export function withExif(jpeg: Buffer, o: ExifOptions): Buffer {
  if (jpeg[0] !== 0xff || jpeg[1] !== 0xd8) throw new Error('not a JPEG');
  return Buffer.concat([jpeg.subarray(0, 2), exifSegment(o), jpeg.subarray(2)]);
}

/**
 * A JPEG whose stored pixels are `width` × `height`, left half red and right half blue, so a
 * reader can tell which way it was turned.
 */
export async function twoToneJpeg(width: number, height: number): Promise<Buffer> {
  const image = new Jimp({ width, height, color: 0xff0000ff });
  image.scan(Math.floor(width / 2), 0, width - Math.floor(width / 2), height, (_x, _y, idx) => {
    image.bitmap.data[idx] = 0;
    image.bitmap.data[idx + 1] = 0;
    image.bitmap.data[idx + 2] = 255;
  });
  return image.getBuffer('image/jpeg', { quality: 95 });
}

/** A PNG of the given size, one colour. */
export async function plainPng(width: number, height: number): Promise<Buffer> {
  return new Jimp({ width, height, color: 0x2e9a3dff }).getBuffer('image/png');
}

/**
 * A PNG that claims huge dimensions in its IHDR chunk but carries almost no data: the
 * "decompression bomb" a decoder would try to allocate width × height × 4 bytes for.
 * Layout per the PNG specification (W3C, 2nd ed., §5.3, §11.2.2): signature, IHDR with CRC.
 */
export function pngBomb(width: number, height: number): Buffer {
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 6; // RGBA
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const typeData = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(typeData));
    return Buffer.concat([len, typeData, crc]);
  };
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])), chunk('IEND', Buffer.alloc(0))]);
}

/** CRC-32 as the PNG specification defines it (Annex D). */
function crc32(data: Buffer): number {
  let c = 0xffffffff;
  for (const byte of data) {
    c ^= byte;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  }
  return (c ^ 0xffffffff) >>> 0;
}

/** A JPEG whose SOF0 frame header claims `width` × `height`, by patching a real small JPEG. */
export async function jpegBomb(width: number, height: number): Promise<Buffer> {
  const jpeg = Buffer.from(await twoToneJpeg(16, 16));
  for (let i = 2; i < jpeg.length - 9; ) {
    if (jpeg[i] !== 0xff) throw new Error('lost JPEG marker sync');
    const marker = jpeg[i + 1]!;
    const len = jpeg.readUInt16BE(i + 2);
    if (marker === 0xc0 || marker === 0xc2) {
      jpeg.writeUInt16BE(height, i + 5);
      jpeg.writeUInt16BE(width, i + 7);
      return jpeg;
    }
    i += 2 + len;
  }
  throw new Error('no SOF marker found');
}
