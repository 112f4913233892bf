// What a minified chunk is made of, module by module: every byte is put down to the source
// module its source map names for it, then each module's bytes are gzipped together. Gzipping
// pieces apart compresses a little worse than the whole chunk, so each module's share is
// scaled to the chunk's real gzip size: an estimate of what moving the module out would save.
import { gzipSync } from 'node:zlib';
import { readScriptMap, RUNTIME } from './source-map';

export interface ModuleShare {
  module: string;
  bytes: number;
  /** Estimated gzip kB of this module inside the chunk (scaled, see above). */
  gzipKb: number;
}

export function chunkModules(chunkPath: string): ModuleShare[] {
  const map = readScriptMap(chunkPath);
  const pieces = new Map<string, string[]>();
  const keep = (module: string, text: string) => {
    if (!text) return;
    const list = pieces.get(module);
    if (list) list.push(text);
    else pieces.set(module, [text]);
  };
  map.code.split('\n').forEach((line, i) => {
    const segments = map.lines[i] ?? [];
    keep(RUNTIME, line.slice(0, segments[0]?.column ?? line.length));
    segments.forEach((s, j) => keep(s.module, line.slice(s.column, segments[j + 1]?.column)));
  });

  const chunkGzip = gzipSync(map.code, { level: 9 }).length;
  const raw = [...pieces].map(([module, texts]) => {
    const text = texts.join('');
    return { module, bytes: Buffer.byteLength(text), gzip: gzipSync(text, { level: 9 }).length };
  });
  const gzipSum = raw.reduce((n, r) => n + r.gzip, 0);
  return raw
    .map((r) => ({
      module: r.module,
      bytes: r.bytes,
      gzipKb: ((r.gzip / gzipSum) * chunkGzip) / 1000,
    }))
    .sort((a, b) => b.gzipKb - a.gzipKb);
}
