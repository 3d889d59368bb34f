/**
 * Benchmark: a 12-megapixel phone JPEG (4000 × 3000, ≈ 4 MB, EXIF orientation and GPS) through the
 * photo pipeline on the test PostgreSQL cluster and a temporary uploads folder.
 *   npx tsx bench/photos.ts [runs=3]
 * Prints, per run: the upload request's own latency (until the 202), the time until the thumbnail
 * is served, and the server process's peak memory (RSS sampled every 10 ms; the image worker is a
 * thread of the same process, so it is included), plus the kernel's high-water mark (VmHWM).
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { makeJpeg, withExif } from '../tests/helpers/images';
import { startDemoServer } from '../tests/helpers/server';
import { upload } from '../tests/helpers/photo-upload';

const runs = Number(process.argv[2] ?? 3);
const MB = 1024 * 1024;

function vmHwmMb(): number | null {
  try {
    const m = /VmHWM:\s+(\d+) kB/.exec(fs.readFileSync('/proc/self/status', 'utf8'));
    return m ? Number(m[1]) / 1024 : null;
  } catch {
    return null;
  }
}

async function main() {
  execFileSync(process.execPath, [path.join(__dirname, '../scripts/pg.mjs'), 'start', '--test'], { stdio: 'ignore' });
  const url = execFileSync(process.execPath, [path.join(__dirname, '../scripts/pg.mjs'), 'url', '--test'], { encoding: 'utf8' }).trim();
  process.env.FRAMESIDE_TEST_DATABASE_URL ??= url;

  const input = withExif(makeJpeg(4000, 3000, { gradient: true, noise: 20, quality: 90 }), { orientation: 6, gps: true });
  const s = await startDemoServer();
  const hive = s.ids.hives.Ash!;
  const agent = s.as.keeper;
  console.log(`input: 4000 × 3000 JPEG, ${(input.length / MB).toFixed(1)} MB; ${os.cpus().length} cores, load ${os.loadavg()[0]!.toFixed(1)}; node ${process.version}`);

  const rows: { upload: number; thumb: number; peak: number; base: number }[] = [];
  try {
    for (let i = 0; i < runs; i++) {
      global.gc?.();
      const base = process.memoryUsage().rss / MB;
      let peak = base;
      const sampler = setInterval(() => {
        peak = Math.max(peak, process.memoryUsage().rss / MB);
      }, 10);
      const t0 = performance.now();
      const res = await upload(agent, hive, [{ buf: input, name: `IMG_${i}.JPG` }]);
      const tUpload = performance.now() - t0;
      if (res.status !== 202) throw new Error(`upload answered ${res.status}: ${JSON.stringify(res.body)}`);
      const id = res.body.photos[0].id as string;
      let tThumb = 0;
      for (;;) {
        const r = await agent.get(`/api/photos/${id}?size=thumb`);
        if (r.status === 200) {
          tThumb = performance.now() - t0;
          break;
        }
        if (r.status !== 409 || r.body.error?.code !== 'photo_processing') throw new Error(`thumbnail answered ${r.status}`);
        if (performance.now() - t0 > 120_000) throw new Error('thumbnail not ready after 120 s');
        await new Promise((r2) => setTimeout(r2, 25));
      }
      clearInterval(sampler);
      rows.push({ upload: tUpload, thumb: tThumb, peak, base });
      console.log(
        `run ${i + 1}: upload request ${tUpload.toFixed(0)} ms (202) · thumbnail ready ${(tThumb / 1000).toFixed(2)} s · RSS ${base.toFixed(0)} → peak ${peak.toFixed(0)} MB (+${(peak - base).toFixed(0)} MB)`,
      );
    }
  } finally {
    await s.close();
  }
  const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  console.log(
    `median of ${runs}: upload request ${med(rows.map((r) => r.upload)).toFixed(0)} ms · thumbnail ready ${(med(rows.map((r) => r.thumb)) / 1000).toFixed(2)} s · peak RSS ${Math.max(...rows.map((r) => r.peak)).toFixed(0)} MB · VmHWM ${vmHwmMb()?.toFixed(0) ?? 'n/a'} MB`,
  );
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
