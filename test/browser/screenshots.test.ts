import { afterEach, describe, expect, inject, test } from 'vitest';
import { mkdirSync, statSync } from 'node:fs';
import { openApp, openBrowser, type Session, SIZES, wholePageScreenshot } from './browser';

const dir = 'test-output/screenshots';
let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

describe('screenshots of the check and machines screens', () => {
  for (const size of SIZES) {
    for (const scheme of ['light', 'dark'] as const) {
      test(`the ${size.name} layout in ${scheme} fits the width and is written to ${dir}`, async () => {
        mkdirSync(dir, { recursive: true });
        session = await openBrowser({
          width: size.width,
          height: size.height,
          colorScheme: scheme,
        });
        const { page } = session;
        await openApp(page, inject('baseUrl'));
        const checkFile = `${dir}/check-${size.name}-${scheme}.png`;
        await page.screenshot({ path: checkFile });
        await wholePageScreenshot(page, `${dir}/check-${size.name}-${scheme}-full.png`);
        // Nothing may stick out sideways: a phone would scroll the whole page.
        const overflow = await page.evaluate(
          () => document.documentElement.scrollWidth - window.innerWidth,
        );
        expect(overflow).toBeLessThanOrEqual(0);
        await page.getByRole('button', { name: 'Machines' }).click();
        await page.getByTestId('machine-list').waitFor();
        const machinesFile = `${dir}/machines-${size.name}-${scheme}.png`;
        await page.screenshot({ path: machinesFile, fullPage: true });
        expect(statSync(checkFile).size).toBeGreaterThan(10_000);
        expect(statSync(machinesFile).size).toBeGreaterThan(10_000);
      });
    }
  }
});
