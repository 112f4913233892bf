import { describe, expect, it } from 'vitest';
import { MAX_FILE_BYTES } from '../../src/state/fileFormat';
import { readImportFile, type ChosenFile } from '../../src/state/importFile';

/** A chosen file of `size` bytes whose text() counts its calls, and fails if `unreadable`. */
function fakeFile(size: number, text: string, unreadable = false) {
  const file = {
    size,
    reads: 0,
    text(): Promise<string> {
      file.reads++;
      if (unreadable) throw new Error('text() must not be called for this file');
      return Promise.resolve(text);
    },
  };
  return file satisfies ChosenFile;
}

describe('reading a chosen import file', () => {
  it('refuses a file over 1 MB by its size alone, without reading it', async () => {
    for (const size of [MAX_FILE_BYTES + 1, 2 * 1024 * 1024, 4 * 1024 ** 3]) {
      const file = fakeFile(size, '', true);
      expect(await readImportFile(file)).toEqual({
        ok: false,
        error: 'This file is larger than 1 MB; a Trueturn machines file is never that big.',
      });
      expect(file.reads).toBe(0);
    }
  });

  it('refuses a file whose size is not a number of bytes, without reading it', async () => {
    const file = fakeFile(NaN, '', true);
    expect((await readImportFile(file)).ok).toBe(false);
    expect(file.reads).toBe(0);
  });

  it('reads a file of up to 1 MB once', async () => {
    const file = fakeFile(MAX_FILE_BYTES, '{"format":"trueturn-machines"}');
    expect(await readImportFile(file)).toEqual({
      ok: true,
      text: '{"format":"trueturn-machines"}',
    });
    expect(file.reads).toBe(1);
  });

  it('turns a file the browser cannot read into a message', async () => {
    const file = {
      size: 10,
      text: () =>
        Promise.reject(new DOMException('The file could not be read.', 'NotReadableError')),
    };
    expect(await readImportFile(file)).toEqual({
      ok: false,
      error: 'This file could not be read.',
    });
  });
});
