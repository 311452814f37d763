/**
 * Invented photos for the demo: a drawn jar of preserve on a worktop, in the colour given, with
 * its label written on it. Drawn from an SVG with sharp, so no real picture is used anywhere.
 */
import sharp from 'sharp';

/** #rrggbb for a hue (degrees), saturation and lightness (fractions 0–1). */
export function hslToHex(hueDeg: number, saturation: number, lightness: number): string {
  const h = (((hueDeg % 360) + 360) % 360) / 60;
  const c = (1 - Math.abs(2 * lightness - 1)) * saturation;
  const x = c * (1 - Math.abs((h % 2) - 1));
  const [r, g, b] = h < 1 ? [c, x, 0] : h < 2 ? [x, c, 0] : h < 3 ? [0, c, x] : h < 4 ? [0, x, c] : h < 5 ? [x, 0, c] : [c, 0, x];
  const m = lightness - c / 2;
  return `#${[r, g, b].map((v) => Math.round((v + m) * 255).toString(16).padStart(2, '0')).join('')}`;
}

function escapeXml(text: string): string {
  return text.replace(/[<>&"']/g, (ch) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[ch]!);
}

/** A 960 × 720 JPEG of a jar filled with preserve of the given hue (degrees), labelled `label`. */
export async function makeDemoPhoto(label: string, hue: number): Promise<Uint8Array> {
  const fill = hslToHex(hue, 0.68, 0.36);
  const fillLight = hslToHex(hue, 0.7, 0.5);
  const shown = label.length > 28 ? `${label.slice(0, 27)}…` : label;
  const text = escapeXml(shown);
  // Bold sans glyphs average about 0.6 em: shrink long labels to fit the 290 px paper label.
  const fontPx = Math.min(34, Math.floor(290 / (0.6 * Math.max(shown.length, 1))));
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="960" height="720" viewBox="0 0 960 720">
  <defs>
    <linearGradient id="wall" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#f4efe6"/><stop offset="1" stop-color="#e2d8c6"/></linearGradient>
    <linearGradient id="preserve" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="${fill}"/><stop offset="0.45" stop-color="${fillLight}"/><stop offset="1" stop-color="${fill}"/></linearGradient>
  </defs>
  <rect width="960" height="720" fill="url(#wall)"/>
  <rect y="560" width="960" height="160" fill="#b89467"/>
  <ellipse cx="480" cy="600" rx="190" ry="26" fill="#00000022"/>
  <rect x="318" y="150" width="324" height="60" rx="10" fill="#c9a227"/>
  <rect x="300" y="205" width="360" height="395" rx="46" fill="#ffffff55" stroke="#ffffffaa" stroke-width="6"/>
  <rect x="312" y="250" width="336" height="338" rx="38" fill="url(#preserve)"/>
  <rect x="350" y="268" width="26" height="300" rx="13" fill="#ffffff33"/>
  <rect x="330" y="360" width="300" height="120" rx="8" fill="#fbf7ee" stroke="#8a7a5c" stroke-width="3"/>
  <text x="480" y="${420 + Math.round(fontPx / 3)}" font-family="sans-serif" font-size="${fontPx}" font-weight="bold" text-anchor="middle" fill="#3d3325">${text}</text>
</svg>`;
  const jpeg = await sharp(Buffer.from(svg)).jpeg({ quality: 82 }).toBuffer();
  return new Uint8Array(jpeg);
}
