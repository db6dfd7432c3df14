/**
 * Draws the app icons of the web app manifest (public/icons/) from Headroom's mark, the
 * gauge of src/components/ui/logo.tsx. Run after changing the mark: `npx tsx scripts/make-icons.ts`.
 * The PNGs are committed, so a build needs neither this script nor sharp's SVG support.
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';

/** The mark on a 32-unit grid; `inset` shrinks it inside the square (maskable icons keep a safe zone). */
function markSvg(size: number, { inset = 0, rounded = true } = {}) {
  const scale = (32 - inset * 2) / 32;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 32 32">
  <rect width="32" height="32" rx="${rounded ? 7 : 0}" fill="#263042"/>
  <g transform="translate(${inset} ${inset}) scale(${scale})">
    <path d="M6 22a10 10 0 0 1 16.5-7.6" fill="none" stroke="#f6f3ec" stroke-width="2.4" stroke-linecap="round"/>
    <path d="M23.2 15A10 10 0 0 1 26 22" fill="none" stroke="#d9622b" stroke-width="2.4" stroke-linecap="round"/>
    <path d="M9.2 18.4l-1.6-.8M12 14.6l-.9-1.5M16 13.2v-1.7" stroke="#f6f3ec" stroke-opacity=".55" stroke-width="1.2" stroke-linecap="round"/>
    <path d="M16 22l5.6-7.2" stroke="#d9622b" stroke-width="2.4" stroke-linecap="round"/>
    <circle cx="16" cy="22" r="2.3" fill="#f6f3ec"/>
  </g>
</svg>`;
}

const out = path.join(import.meta.dirname, '..', 'public', 'icons');
fs.mkdirSync(out, { recursive: true });
const icons: [string, number, Parameters<typeof markSvg>[1]][] = [
  ['icon-192.png', 192, {}],
  ['icon-512.png', 512, {}],
  // Maskable: full-bleed background, the mark inside the central 80 % safe zone.
  ['icon-maskable-512.png', 512, { inset: 4, rounded: false }],
  ['apple-touch-icon.png', 180, { rounded: false }],
];
for (const [name, size, opts] of icons) {
  await sharp(Buffer.from(markSvg(size, opts)), { density: 72 * (size / 32) })
    .resize(size, size)
    .png()
    .toFile(path.join(out, name));
  console.log(`public/icons/${name}`);
}
