// What the UI benchmark ran on: its figures depend on the CPU and on what else the machine was
// doing, so both are printed beside them.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { CHROMIUM } from '../../browser/browser';

export interface Machine {
  cpuModel: string;
  cores: number;
  /** 1, 5 and 15 minute load averages when the benchmark started. */
  loadAtStart: [number, number, number];
  node: string;
  chromium: string;
  chromiumPath: string;
}

/** Describes this machine; throws when Chromium is missing, since nothing could be measured. */
export function describeMachine(): Machine {
  if (!existsSync(CHROMIUM)) {
    throw new Error(
      `Chromium not found at ${CHROMIUM}: install it (apt-get install chromium) or set CHROMIUM_PATH.`,
    );
  }
  // Debian's start script prints a harmless "[: …: unexpected operator" on stderr; keep stdout.
  const version = execFileSync(CHROMIUM, ['--version'], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'ignore'],
  }).trim();
  const cores = cpus();
  const [one, five, fifteen] = loadavg();
  return {
    cpuModel: cores[0]?.model.trim() ?? 'unknown',
    cores: cores.length,
    loadAtStart: [one, five, fifteen],
    node: process.version,
    chromium: version,
    chromiumPath: CHROMIUM,
  };
}

/** "1.22, 2.52, 3.53" */
export function formatLoad([one, five, fifteen]: readonly number[]): string {
  return [one, five, fifteen].map((x) => x.toFixed(2)).join(', ');
}

export function currentLoad(): [number, number, number] {
  const [one, five, fifteen] = loadavg();
  return [one, five, fifteen];
}
