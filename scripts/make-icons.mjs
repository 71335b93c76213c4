// Draws the installable app's icons from one picture of a candle on a needle whorl:
// 192 and 512 px with rounded corners, and a 512 px maskable one whose drawing keeps inside the
// central 80 % safe zone on a full-bleed background. Run: node scripts/make-icons.mjs
import sharp from 'sharp';

const mark = `<rect x="13" y="5" width="6" height="15" rx="3" fill="#c4d9ba"/><path d="M16 20v8M16 22l-7 4M16 22l7 4M16 25l-5 3M16 25l5 3" stroke="#e2ecdc" stroke-width="1.6" stroke-linecap="round"/>`;
const rounded = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32"><rect width="32" height="32" rx="7" fill="#33522c"/>${mark}</svg>`;
// Maskable: square background, the mark scaled to 60 % around the centre.
const maskable = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32"><rect width="32" height="32" fill="#33522c"/><g transform="translate(6.4 6.4) scale(0.6)">${mark}</g></svg>`;

const out = [
  ['public/icons/icon-192.png', rounded, 192],
  ['public/icons/icon-512.png', rounded, 512],
  ['public/icons/maskable-512.png', maskable, 512],
];
for (const [file, svg, size] of out) {
  await sharp(Buffer.from(svg), { density: 72 * (size / 32) })
    .resize(size, size)
    .png()
    .toFile(file);
  console.log('wrote', file);
}
