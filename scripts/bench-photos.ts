/**
 * npm run bench:photos — what one photo upload costs the server: the time to
 * turn a 12-megapixel camera JPEG into the stored web copy and thumbnail, and
 * the process's peak memory with one and with four conversions at once.
 * Prints figures; asserts nothing (speed lives here, not in timed tests).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { processPhoto } from '@server/features/photos/photos.images';

const runs = 7;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-bench-photos-'));

/** A 4000 × 3000 JPEG with camera-like noise (so it compresses like a photo, ~6–8 MB) and EXIF. */
async function cameraJpeg(file: string) {
  const data = await sharp({
    create: {
      width: 4000,
      height: 3000,
      channels: 3,
      background: '#6b7f8f',
      noise: { type: 'gaussian', mean: 128, sigma: 60 },
    },
  })
    .jpeg({ quality: 92 })
    .withExif({ IFD0: { Make: 'Bench camera', Model: 'Twelve' } })
    .toBuffer();
  fs.writeFileSync(file, data);
  return data.length;
}

let peak = 0;
const sampler = setInterval(() => {
  peak = Math.max(peak, process.memoryUsage.rss());
}, 5);
const mb = (b: number) => (b / 1024 / 1024).toFixed(0);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

try {
  const file = path.join(dir, 'camera.jpg');
  const bytes = await cameraJpeg(file);
  console.log(
    `\nHeadroom photo benchmark: 4000 × 3000 JPEG, ${(bytes / 1e6).toFixed(1)} MB, ${os.cpus().length} cores\n`,
  );
  // Warm-up: the first call loads codecs.
  await processPhoto(file, 'camera.jpg', bytes);

  const times: number[] = [];
  const base = process.memoryUsage.rss();
  peak = base;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await processPhoto(file, 'camera.jpg', bytes);
    times.push(performance.now() - t0);
  }
  console.log(
    `one at a time:  median ${median(times).toFixed(0)} ms, fastest ${Math.min(...times).toFixed(0)} ms, slowest ${Math.max(...times).toFixed(0)} ms (${runs} runs)`,
  );
  console.log(`                RSS ${mb(base)} MB before, ${mb(peak)} MB at most`);

  const base4 = process.memoryUsage.rss();
  peak = base4;
  const t0 = performance.now();
  await Promise.all(Array.from({ length: 4 }, () => processPhoto(file, 'camera.jpg', bytes)));
  const all4 = performance.now() - t0;
  console.log(
    `four at once:   all done in ${all4.toFixed(0)} ms; RSS ${mb(base4)} MB before, ${mb(peak)} MB at most\n`,
  );
} finally {
  clearInterval(sampler);
  fs.rmSync(dir, { recursive: true, force: true });
}
