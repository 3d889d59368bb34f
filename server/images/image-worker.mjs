// The image worker: decodes one upload at a time and re-encodes it into the stored sizes.
// Plain JavaScript on purpose: it runs in a worker thread under tsx, Jest and plain Node alike
// (jimp's ESM-only parts cannot load inside Jest's VM, see SETUP-NOTES), and it keeps the
// slow, memory-hungry decode off the thread that answers requests.
import { parentPort } from 'node:worker_threads';
import { Jimp } from 'jimp';
import { imageSize } from 'image-size';

const PNG_SIG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function sniff(buf) {
  if (buf.length >= 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) return 'jpeg';
  if (buf.length >= 8 && buf.subarray(0, 8).equals(PNG_SIG)) return 'png';
  return null;
}

function fit(w, h, side) {
  const long = Math.max(w, h);
  if (long <= side) return null; // never enlarge
  const s = side / long;
  return { w: Math.max(1, Math.round(w * s)), h: Math.max(1, Math.round(h * s)) };
}

class Refused extends Error {
  constructor(reason, extra = {}) {
    super(reason);
    this.reason = reason;
    this.extra = extra;
  }
}

async function processImage(buf, limits) {
  const kind = sniff(buf);
  if (!kind) throw new Refused('not_image');
  // The header first: a decompression bomb is refused by its claimed size, before any decoding.
  let dims;
  try {
    dims = imageSize(buf);
  } catch {
    throw new Refused('not_image');
  }
  const w0 = dims.width ?? 0;
  const h0 = dims.height ?? 0;
  if (w0 < 1 || h0 < 1) throw new Refused('not_image');
  if (w0 * h0 > limits.maxPixels || Math.max(w0, h0) > limits.maxSide) {
    throw new Refused('too_many_pixels', { width: w0, height: h0 });
  }
  let img;
  try {
    // jimp reads the EXIF orientation and turns the pixels upright as it decodes.
    img = await Jimp.read(buf);
  } catch {
    throw new Refused('undecodable');
  }
  buf = null;
  if (kind === 'png' && img.hasAlpha()) {
    // JPEG has no transparency: lay the picture on white rather than on black.
    const bg = new Jimp({ width: img.bitmap.width, height: img.bitmap.height, color: 0xffffffff });
    bg.composite(img, 0, 0);
    img = bg;
  }
  const width = img.bitmap.width;
  const height = img.bitmap.height;
  // Every stored size is encoded from pixels only: no EXIF, XMP, ICC or comment survives, GPS above all.
  const original = await img.getBuffer('image/jpeg', { quality: limits.originalQuality });
  const displayFit = fit(width, height, limits.displaySide);
  if (displayFit) img.resize({ w: displayFit.w, h: displayFit.h });
  const display = displayFit ? await img.getBuffer("image/jpeg", { quality: limits.derivedQuality }) : original;
  const thumbFit = fit(img.bitmap.width, img.bitmap.height, limits.thumbSide);
  if (thumbFit) img.resize({ w: thumbFit.w, h: thumbFit.h });
  const thumb = thumbFit ? await img.getBuffer('image/jpeg', { quality: limits.derivedQuality }) : display;
  return { width, height, original, display, thumb };
}

parentPort.on('message', async (msg) => {
  const { id, input, limits } = msg;
  try {
    const r = await processImage(Buffer.from(input), limits);
    const out = [r.original, r.display, r.thumb].map((b) => Uint8Array.from(b));
    parentPort.postMessage(
      { id, ok: true, width: r.width, height: r.height, original: out[0], display: out[1], thumb: out[2] },
      [...new Set(out.map((b) => b.buffer))],
    );
  } catch (err) {
    if (err instanceof Refused) parentPort.postMessage({ id, ok: false, reason: err.reason, ...err.extra });
    else parentPort.postMessage({ id, ok: false, reason: 'internal', detail: String(err?.message ?? err) });
  }
});
