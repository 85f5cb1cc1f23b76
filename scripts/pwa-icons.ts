/**
 * Renders the app icons for the web app manifest from public/seepwise.svg (run after changing the
 * logo, then commit the PNGs):
 *
 *   npx tsx scripts/pwa-icons.ts
 *
 * - icon-192.png, icon-512.png: the logo as drawn (rounded tile, transparent corners), purpose "any".
 * - icon-maskable-512.png: a full-bleed tile with the pot inside the central safe circle (radius
 *   40 % of the size), so a launcher may crop it to any shape, purpose "maskable".
 * - apple-touch-icon.png (180): full-bleed and opaque; iOS rounds the corners itself.
 */
import { Resvg } from '@resvg/resvg-js';
import fs from 'node:fs';
import path from 'node:path';

const pub = path.resolve('public');
const logo = fs.readFileSync(path.join(pub, 'seepwise.svg'), 'utf8');
const TILE = '#f6efe4';

/** The drawing inside the logo's <svg>, without its rounded background tile. */
const glyph = logo.replace(/^<svg[^>]*>/, '').replace(/<\/svg>\s*$/, '').replace(/<rect[^>]*\/>/, '');

/** A square tile with the pot scaled about its centre (the pot spans y 14–54, centre 34). */
const fullBleed = (scale: number) =>
  `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64"><rect width="64" height="64" fill="${TILE}"/><g transform="translate(32 32) scale(${scale}) translate(-32 -34)">${glyph}</g></svg>`;

function render(svg: string, size: number, file: string) {
  const png = new Resvg(svg, { fitTo: { mode: 'width', value: size } }).render().asPng();
  fs.writeFileSync(path.join(pub, file), png);
  console.log(`${file}: ${size}×${size}, ${png.length} bytes`);
}

render(logo, 192, 'icon-192.png');
render(logo, 512, 'icon-512.png');
// The pot's farthest corner is 28.4 units from its centre; 0.85 × 28.4 = 24.2 < 25.6 (40 % of 64).
render(fullBleed(0.85), 512, 'icon-maskable-512.png');
render(fullBleed(1), 180, 'apple-touch-icon.png');
