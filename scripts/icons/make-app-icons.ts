// Renders the app's icon (public/icons/patchwise.svg) to the PNG sizes the web app manifest lists:
// `npx tsx scripts/icons/make-app-icons.ts`. The maskable one keeps the drawing inside the safe 80 % circle.
import fs from 'node:fs';
import path from 'node:path';
import { Resvg } from '@resvg/resvg-js';

const dir = path.resolve(import.meta.dirname, '../../public/icons');
const svg = fs.readFileSync(path.join(dir, 'patchwise.svg'), 'utf8');

function render(source: string, size: number, file: string) {
  const png = new Resvg(source, { fitTo: { mode: 'width', value: size } }).render().asPng();
  fs.writeFileSync(path.join(dir, file), png);
  console.log(`${file}: ${size}×${size}, ${png.length} bytes`);
}

render(svg, 192, 'icon-192.png');
render(svg, 512, 'icon-512.png');
render(svg, 180, 'apple-touch-icon.png');
// Maskable: a full-bleed background, the drawing scaled to 80 % about the centre.
const inner = svg.replace(/^<svg[^>]*>/, '').replace(/<\/svg>\s*$/, '');
const maskable = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512"><rect width="512" height="512" fill="#2f5d3a"/><g transform="translate(51.2 51.2) scale(0.8)">${inner}</g></svg>`;
render(maskable, 512, 'icon-maskable-512.png');
