// Reads a built script's source map (Source Map Revision 3: "mappings" in Base64 VLQ) to tell
// which source module each piece of the built code came from.
import { existsSync, readFileSync } from 'node:fs';

const BASE64 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
export const RUNTIME = '(bundler runtime)';

/** Decodes one mappings segment ("AAAA") into its numbers. */
function decodeVlq(segment: string): number[] {
  const out: number[] = [];
  let value = 0;
  let shift = 0;
  for (const ch of segment) {
    const digit = BASE64.indexOf(ch);
    if (digit < 0) throw new Error(`bad source map character "${ch}"`);
    value += (digit & 31) << shift;
    if (digit & 32) {
      shift += 5;
    } else {
      out.push(value & 1 ? -(value >>> 1) : value >>> 1);
      value = 0;
      shift = 0;
    }
  }
  return out;
}

export interface Segment {
  /** 0-based column in the built line where the segment starts. */
  column: number;
  /** Source module (as cleaned by `moduleName`), or RUNTIME for code with no source. */
  module: string;
}

export interface ScriptMap {
  code: string;
  /** Segments of each built line (0-based), in column order. */
  lines: Segment[][];
}

export function readScriptMap(scriptPath: string): ScriptMap {
  const mapPath = `${scriptPath}.map`;
  // The bundler's own runtime chunk (rolldown-runtime-*.js) comes without a map: all of it is
  // the bundler's.
  if (!existsSync(mapPath)) return { code: readFileSync(scriptPath, 'utf8'), lines: [] };
  const map = JSON.parse(readFileSync(mapPath, 'utf8')) as { sources: string[]; mappings: string };
  const modules = map.sources.map(moduleName);
  let source = 0;
  const lines = map.mappings.split(';').map((lineMappings) => {
    let column = 0;
    const segments: Segment[] = [];
    for (const text of lineMappings.split(',')) {
      if (!text) continue;
      const fields = decodeVlq(text);
      column += fields[0];
      if (fields.length >= 4) source += fields[1];
      segments.push({ column, module: fields.length >= 4 ? modules[source] : RUNTIME });
    }
    return segments;
  });
  return { code: readFileSync(scriptPath, 'utf8'), lines };
}

/** The source module of the built code at `line`, `column` (both 0-based). */
export function moduleAt(map: ScriptMap, line: number, column: number): string {
  const segments = map.lines[line] ?? [];
  let found = RUNTIME;
  for (const s of segments) {
    if (s.column > column) break;
    found = s.module;
  }
  return found;
}

/** "../../../src/ui/x.tsx" → "src/ui/x.tsx"; "\0vite/…" → "vite/…". */
function moduleName(source: string | null | undefined): string {
  if (!source) return RUNTIME;
  return source.replace(/^(\.\.\/)+/, '').replace(/^\0/, '');
}
