/**
 * Register photos: time and peak memory (resident set) of turning a 40-megapixel camera photo into the served
 * image and thumbnail, as JPEG and as PNG, in a process of its own (target: resident memory rises by less than
 * 150 MB while it runs — the decoded image alone would be 120 MB — and it takes a few seconds at most). Prints
 * one JSON object.
 */
import { performance } from 'node:perf_hooks';
import sharp from 'sharp';
import { processPhoto } from '../server/register/photos';

async function measure(buf: Buffer, name: string) {
  global.gc?.();
  const before = process.memoryUsage().rss;
  let peak = before;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, 5);
  const t0 = performance.now();
  const out = await processPhoto(buf, { name, field: 'photos[0]', keepLocation: false });
  const ms = performance.now() - t0;
  clearInterval(timer);
  peak = Math.max(peak, process.memoryUsage().rss);
  return { inputMB: Number((buf.length / 1e6).toFixed(2)), ms: Math.round(ms), peakRssMB: Math.round(peak / 1e6), rssRiseMB: Math.round((peak - before) / 1e6), served: `${out.width}x${out.height}` };
}

async function main(): Promise<void> {
  // 7744 × 5164 ≈ 40 megapixels of noise, so the decoders have real work to do.
  const raw = () => sharp({ create: { width: 7744, height: 5164, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } } });
  const jpeg = await raw().jpeg({ quality: 90 }).toBuffer();
  const png = await raw().png({ compressionLevel: 1 }).toBuffer();
  const figures = { jpeg40mp: await measure(jpeg, '40mp.jpg'), png40mp: await measure(png, '40mp.png') };
  process.stdout.write(JSON.stringify(figures) + '\n');
}

main().catch((e) => {
  process.stdout.write(JSON.stringify({ note: `failed: ${(e as Error).message}` }) + '\n');
});
