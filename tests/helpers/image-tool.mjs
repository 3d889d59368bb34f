// Builds and reads test images with jimp in a plain Node process: jimp's ESM-only parts cannot
// load inside Jest's VM (see SETUP-NOTES), so the tests call this through a child process.
//   node image-tool.mjs make '{"width":400,"height":200,"split":true,"quality":90}'  → JPEG bytes on stdout
//   node image-tool.mjs pixels '{"file":"/path.jpg","points":[[x,y],…]}'               → JSON on stdout
import fs from 'node:fs';
import { Jimp } from 'jimp';

const [cmd, arg] = process.argv.slice(2);
const opts = JSON.parse(arg ?? '{}');

const clamp = (v) => Math.max(0, Math.min(255, Math.round(v)));

if (cmd === 'make') {
  // Left half red, right half blue (or a smooth gradient for a photo-like benchmark input).
  const { width, height } = opts;
  const img = new Jimp({ width, height, color: 0xff0000ff });
  const data = img.bitmap.data;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 4;
      if (opts.gradient) {
        // Optional noise (hashed per 3 × 3 block) gives the JPEG a photo's entropy and so a photo's file size.
        const n = opts.noise ? (((Math.imul((x / 3) | 0, 73856093) ^ Math.imul((y / 3) | 0, 19349663)) >>> 0) % (2 * opts.noise)) - opts.noise : 0;
        data[i] = clamp((x * 255) / width + n);
        data[i + 1] = clamp((y * 255) / height + n);
        data[i + 2] = clamp(128 + 100 * Math.sin(x / 300) * Math.cos(y / 200) + n);
      } else if (opts.split && x >= width / 2) {
        data[i] = 0;
        data[i + 2] = 255;
      }
      data[i + 3] = 255;
    }
  }
  const buf = await img.getBuffer(opts.png ? 'image/png' : 'image/jpeg', opts.png ? {} : { quality: opts.quality ?? 90 });
  process.stdout.write(buf);
} else if (cmd === 'pixels') {
  const img = await Jimp.read(fs.readFileSync(opts.file));
  const colours = (opts.points ?? []).map(([x, y]) => {
    const c = img.getPixelColor(x, y);
    return [(c >>> 24) & 255, (c >>> 16) & 255, (c >>> 8) & 255];
  });
  process.stdout.write(JSON.stringify({ width: img.bitmap.width, height: img.bitmap.height, colours }));
} else {
  console.error('usage: image-tool.mjs make|pixels JSON');
  process.exit(2);
}
