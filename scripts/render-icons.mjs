// Renders the app icons from our own SVG drawings with headless Chromium (playwright-core
// driving the system browser), from scripts/icons/*.svg: icon-192.png, icon-512.png and icon-maskable-512.png in public/.
// Run: node scripts/render-icons.mjs   (needs /usr/bin/chromium or CHROMIUM_PATH)
import { chromium } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const publicDir = fileURLToPath(new URL('../public/', import.meta.url));
const sourceDir = fileURLToPath(new URL('./icons/', import.meta.url));
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

const jobs = [
  { svg: 'icon.svg', out: 'icon-192.png', size: 192 },
  { svg: 'icon.svg', out: 'icon-512.png', size: 512 },
  { svg: 'icon-maskable.svg', out: 'icon-maskable-512.png', size: 512 },
];

const browser = await chromium.launch({
  executablePath,
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
});
try {
  const page = await browser.newPage({ deviceScaleFactor: 1 });
  for (const { svg, out, size } of jobs) {
    const markup = readFileSync(sourceDir + svg, 'utf8');
    await page.setViewportSize({ width: size, height: size });
    await page.setContent(
      `<!doctype html><html><body style="margin:0;background:transparent">` +
        `<div style="width:${size}px;height:${size}px">${markup.replace('<svg ', `<svg width="${size}" height="${size}" `)}</div>` +
        `</body></html>`,
    );
    await page.screenshot({
      path: publicDir + out,
      omitBackground: true,
      clip: { x: 0, y: 0, width: size, height: size },
    });
    console.log(`wrote public/${out}`);
  }
} finally {
  await browser.close();
}
