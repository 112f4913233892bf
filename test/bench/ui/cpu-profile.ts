// Self time of a V8 CPU profile (CDP Profiler.stop), put down to source modules (through the
// build's source maps) and to functions (names kept: the profile build is not minified).
// Each sample lasts until the next one.
import { join } from 'node:path';
import { moduleAt, readScriptMap, type ScriptMap } from './source-map';

export interface CpuProfile {
  nodes: Array<{
    id: number;
    callFrame: { functionName: string; url: string; lineNumber: number; columnNumber: number };
  }>;
  samples?: number[];
  timeDeltas?: number[];
  startTime: number;
  endTime: number;
}

export interface SelfTime {
  name: string;
  ms: number;
}

export interface ProfileSummary {
  totalMs: number;
  byModule: SelfTime[];
  byFunction: SelfTime[];
}

/** Summarises `profile` of a page served from `distDir`. */
export function summariseProfile(profile: CpuProfile, distDir: string): ProfileSummary {
  const maps = new Map<string, ScriptMap>();
  const mapOf = (file: string) => {
    let map = maps.get(file);
    if (!map) maps.set(file, (map = readScriptMap(join(distDir, file))));
    return map;
  };
  const samples = profile.samples ?? [];
  const deltas = profile.timeDeltas ?? [];
  const selfUs = new Map<number, number>();
  samples.forEach((id, i) => selfUs.set(id, (selfUs.get(id) ?? 0) + (deltas[i + 1] ?? 0)));

  const byModule = new Map<string, number>();
  const byFunction = new Map<string, number>();
  const add = (m: Map<string, number>, key: string, us: number) =>
    m.set(key, (m.get(key) ?? 0) + us);
  let totalUs = 0;
  for (const node of profile.nodes) {
    const us = selfUs.get(node.id) ?? 0;
    const { functionName, url, lineNumber, columnNumber } = node.callFrame;
    if (us === 0 || functionName === '(idle)') continue;
    totalUs += us;
    const file = /\/(assets\/[^/?#]+\.js)$/.exec(url)?.[1];
    if (file) {
      const module = moduleAt(mapOf(file), lineNumber, columnNumber);
      add(byModule, module, us);
      add(byFunction, `${functionName || '(anonymous)'}  ${module}`, us);
    } else {
      // "(program)" is the browser's own work (style, layout, paint …), "(garbage collector)";
      // a named frame with no script is a built-in (canvas drawing, DOM setters …).
      const kind = functionName.startsWith('(')
        ? functionName
        : url
          ? '(other script)'
          : '(built-ins)';
      add(byModule, kind, us);
      add(
        byFunction,
        functionName.startsWith('(') || url ? kind : `${functionName}  (built-in)`,
        us,
      );
    }
  }
  const sorted = (m: Map<string, number>) =>
    [...m].map(([name, us]) => ({ name, ms: us / 1000 })).sort((a, b) => b.ms - a.ms);
  return { totalMs: totalUs / 1000, byModule: sorted(byModule), byFunction: sorted(byFunction) };
}
