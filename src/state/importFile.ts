// The first step of an import: the chosen file's text, or why it was not read. The size is
// checked before a byte is read (docs/file-format.md, "Rules when reading"), so a film or a disk
// image chosen by mistake is refused at once instead of being loaded into memory.
import { MAX_FILE_BYTES } from './fileFormat';

/** The text of a chosen file, or a message saying why it was not read. */
export type ImportText = { ok: true; text: string } | { ok: false; error: string };

/** What is needed of a chosen file: its size in bytes and a way to read it (a File or Blob). */
export interface ChosenFile {
  readonly size: number;
  text(): Promise<string>;
}

/**
 * Reads a chosen machines file as text. A file over MAX_FILE_BYTES is refused by its size
 * alone, unread; a file the browser cannot read is refused too. Never throws.
 */
export async function readImportFile(file: ChosenFile): Promise<ImportText> {
  if (!(file.size <= MAX_FILE_BYTES)) {
    return {
      ok: false,
      error: `This file is larger than ${MAX_FILE_BYTES / (1024 * 1024)} MB; a Trueturn machines file is never that big.`,
    };
  }
  try {
    return { ok: true, text: await file.text() };
  } catch {
    return { ok: false, error: 'This file could not be read.' };
  }
}
