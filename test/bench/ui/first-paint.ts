// The script and style bytes the built page needs before its first paint: what index.html
// loads (scripts, module preloads, style sheets, inline code) and every chunk the entry imports
// statically, with their CSS, as Vite's manifest records them. Dynamic imports load after the
// first paint and are left out. Each file is gzipped on its own (level 9) and the sizes summed.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

export interface FirstPaintFile {
  /** Path inside the build, or "index.html (inline …)" for code written into the page. */
  file: string;
  /** Why it loads before the first paint. */
  why: string;
  bytes: number;
  gzipBytes: number;
}

interface ManifestChunk {
  file: string;
  imports?: string[];
  css?: string[];
  isEntry?: boolean;
}

export function firstPaintFiles(distDir: string): FirstPaintFile[] {
  const html = readFileSync(join(distDir, 'index.html'), 'utf8');
  const manifestPath = join(distDir, '.vite/manifest.json');
  if (!existsSync(manifestPath)) throw new Error(`no Vite manifest at ${manifestPath}`);
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Record<string, ManifestChunk>;
  const byFile = new Map(Object.values(manifest).map((chunk) => [chunk.file, chunk]));

  const found = new Map<string, { why: string; content: Buffer }>();
  const add = (file: string, why: string) => {
    if (found.has(file)) return;
    const path = join(distDir, file);
    if (!existsSync(path)) throw new Error(`index.html or the manifest names ${file}, not built`);
    found.set(file, { why, content: readFileSync(path) });
  };
  const addChunk = (chunk: ManifestChunk, why: string) => {
    add(chunk.file, why);
    for (const css of chunk.css ?? []) add(css, `style sheet of ${chunk.file}`);
    for (const key of chunk.imports ?? []) {
      const imported = manifest[key];
      if (!imported) throw new Error(`manifest: ${chunk.file} imports ${key}, not in the manifest`);
      if (!found.has(imported.file)) addChunk(imported, `static import of ${chunk.file}`);
    }
  };

  let inline = 0;
  for (const tag of tags(html)) {
    if (tag.name === 'script' && tag.attrs.src) {
      const file = local(tag.attrs.src);
      const chunk = byFile.get(file);
      if (chunk) addChunk(chunk, tag.attrs.type === 'module' ? 'entry module' : 'script');
      else add(file, 'script');
    } else if (tag.name === 'script' && tag.body.trim()) {
      found.set(`index.html (inline script ${++inline})`, {
        why: 'inline script',
        content: Buffer.from(tag.body),
      });
    } else if (tag.name === 'style' && tag.body.trim()) {
      found.set(`index.html (inline style ${++inline})`, {
        why: 'inline style',
        content: Buffer.from(tag.body),
      });
    } else if (tag.name === 'link' && tag.attrs.href) {
      const rel = (tag.attrs.rel ?? '').toLowerCase();
      if (rel === 'modulepreload') add(local(tag.attrs.href), 'module preload');
      if (rel === 'stylesheet') add(local(tag.attrs.href), 'style sheet');
    }
  }
  if (found.size === 0) throw new Error('index.html loads no script or style sheet');
  return [...found].map(([file, { why, content }]) => ({
    file,
    why,
    bytes: content.length,
    gzipBytes: gzipSync(content, { level: 9 }).length,
  }));
}

interface Tag {
  name: string;
  attrs: Record<string, string>;
  body: string;
}

/** The script, link and style tags of a page as Vite writes it (quoted or bare attributes). */
function tags(html: string): Tag[] {
  const out: Tag[] = [];
  const tagPattern = /<(script|link|style)\b([^>]*)>(?:([\s\S]*?)<\/\1\s*>)?/gi;
  for (const m of html.matchAll(tagPattern)) {
    const attrs: Record<string, string> = {};
    for (const a of m[2].matchAll(/([\w-]+)(?:\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'>]+)))?/g)) {
      attrs[a[1].toLowerCase()] = a[2] ?? a[3] ?? a[4] ?? '';
    }
    out.push({ name: m[1].toLowerCase(), attrs, body: m[3] ?? '' });
  }
  return out;
}

/** "/assets/x.js" or "./assets/x.js" → "assets/x.js"; other origins are refused. */
function local(url: string): string {
  if (/^[a-z]+:|^\/\//i.test(url)) throw new Error(`index.html loads ${url} from elsewhere`);
  return url.replace(/^\.?\//, '').split(/[?#]/)[0];
}
