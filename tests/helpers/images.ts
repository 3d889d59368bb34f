/** Test images, made in the test: JPEG/PNG through jimp in a child process, EXIF through piexifjs, PNG headers by hand. */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import zlib from 'node:zlib';
// piexifjs 1.0.6 (npm): writes EXIF (orientation, GPS) into a JPEG, as a camera would.
import piexif from 'piexifjs';

const TOOL = path.join(__dirname, 'image-tool.mjs');

/** A JPEG of the given size: left half red, right half blue (or a gradient). */
export function makeJpeg(width: number, height: number, opts: { gradient?: boolean; quality?: number; noise?: number } = {}): Buffer {
  return execFileSync(process.execPath, [TOOL, 'make', JSON.stringify({ width, height, split: !opts.gradient, ...opts })], {
    maxBuffer: 64 * 1024 * 1024,
  });
}

export function makePng(width: number, height: number): Buffer {
  return execFileSync(process.execPath, [TOOL, 'make', JSON.stringify({ width, height, split: true, png: true })], {
    maxBuffer: 64 * 1024 * 1024,
  });
}

/** Decodes a stored image (in a child process) and reads pixel colours as [r, g, b]. */
export function readPixels(file: string, points: [number, number][]): { width: number; height: number; colours: [number, number, number][] } {
  return JSON.parse(execFileSync(process.execPath, [TOOL, 'pixels', JSON.stringify({ file, points })], { encoding: 'utf8' }));
}

/** Adds EXIF to a JPEG: an orientation and a GPS position (a made-up point), as a phone camera writes them. */
export function withExif(jpeg: Buffer, opts: { orientation?: number; gps?: boolean }): Buffer {
  const zeroth: Record<number, unknown> = { [piexif.ImageIFD.Make]: 'TestCam', [piexif.ImageIFD.Software]: 'frameside-tests' };
  if (opts.orientation) zeroth[piexif.ImageIFD.Orientation] = opts.orientation;
  const gps: Record<number, unknown> = opts.gps
    ? {
        [piexif.GPSIFD.GPSLatitudeRef]: 'N',
        [piexif.GPSIFD.GPSLatitude]: [
          [52, 1],
          [12, 1],
          [3456, 100],
        ],
        [piexif.GPSIFD.GPSLongitudeRef]: 'W',
        [piexif.GPSIFD.GPSLongitude]: [
          [1, 1],
          [23, 1],
          [4567, 100],
        ],
      }
    : {};
  const exif = piexif.dump({ '0th': zeroth, Exif: {}, GPS: gps });
  return Buffer.from(piexif.insert(exif, jpeg.toString('binary')), 'binary');
}

const crc32 = (buf: Buffer): number => zlib.crc32(buf);

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td) >>> 0);
  return Buffer.concat([len, td, crc]);
}

/**
 * A decompression bomb in miniature: a well-formed PNG whose header claims width × height
 * (e.g. 30000 × 30000 = 900 megapixels) while the file is a few hundred bytes. Its one IDAT holds
 * a single compressed row, so a decoder that trusted the header would allocate gigabytes first.
 */
export function pngClaiming(width: number, height: number): Buffer {
  const sig = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: RGB
  const idat = zlib.deflateSync(Buffer.alloc(1 + width * 3));
  return Buffer.concat([sig, chunk('IHDR', ihdr), chunk('IDAT', idat), chunk('IEND', Buffer.alloc(0))]);
}
