// Share a machine as a link: the whole machine on screen (its name, site, notes, parts, sampler
// and every tool's inputs) travels in the page address after "#", so it never reaches a server.
// Fragment layout (docs/file-format.md, "Share links"):
//   #s=<version>.<machine content as JSON, UTF-8, base64url without padding>
// e.g. "#s=2.eyJuYW1lIjo…". Version 1 links carried a set-up only and still open. Whatever a
// link holds is untrusted: it is decoded strictly and goes through validateContent; callers show
// names from it as text, never as markup.

import { blankHeader, defaultToolInputs, type MachineContent } from './model';
import { DataError, validateContent, validateSetup } from './validate';

/** Version of the link payload this app writes; it reads this one and version 1. */
export const SHARE_LINK_VERSION = 2;
/** Oldest link payload this app still reads (a set-up only). */
export const OLDEST_SHARE_LINK_VERSION = 1;
/** Longest share payload accepted or made, in characters after "s=" (8 KiB). */
export const MAX_SHARE_CHARS = 8 * 1024;
/**
 * Longest page address fragment read at all (16 KiB): a share payload and room for other
 * fields. Anything longer is refused by its length alone, before it is split, matched or decoded.
 */
export const MAX_FRAGMENT_CHARS = 2 * MAX_SHARE_CHARS;
/** Name of the fragment field that carries a set-up. */
const FIELD = 's';

/**
 * The fragment ("#s=2.…") that carries a machine's content. It is checked and copied field by
 * field first, so only known fields travel.
 * Throws DataError if it is invalid or too large for a link (MAX_SHARE_CHARS).
 */
export function encodeShareFragment(content: MachineContent): string {
  const clean = validateContent(content);
  const payload = `${SHARE_LINK_VERSION}.${toBase64Url(new TextEncoder().encode(JSON.stringify(clean)))}`;
  if (payload.length > MAX_SHARE_CHARS) {
    throw new DataError(
      'set-up',
      'This machine is too large to share as a link (too many parts, readings or long notes); export it as a file instead.',
    );
  }
  return `#${FIELD}=${payload}`;
}

/** What a page address fragment held: a checked machine, a refusal, or no share data at all. */
export type DecodeShareResult =
  { ok: true; content: MachineContent } | { ok: false; error: string } | { ok: false; error: null };

const BROKEN = 'This share link is damaged or cut short; ask for the link again.';
const TOO_LONG = 'This share link is too long to be a Trueturn link; it was not opened.';

/**
 * Reads a machine from a page address fragment (`location.hash`, with or without "#").
 * Never throws. `error: null` means the fragment carries no share data (nothing to report);
 * a string error is a message for the user (tampered, truncated, too long, newer version,
 * invalid set-up).
 */
export function decodeShareFragment(hash: string): DecodeShareResult {
  if (typeof hash !== 'string') return { ok: false, error: null };
  if (hash.length > MAX_FRAGMENT_CHARS) return { ok: false, error: TOO_LONG };
  const payload = findField(hash.startsWith('#') ? hash.slice(1) : hash);
  if (payload === null) return { ok: false, error: null };
  if (payload.length > MAX_SHARE_CHARS) return { ok: false, error: TOO_LONG };
  const m = /^(\d{1,6})\.([A-Za-z0-9_-]+)$/.exec(payload);
  if (!m) return { ok: false, error: BROKEN };
  const version = Number(m[1]);
  if (version > SHARE_LINK_VERSION || version < OLDEST_SHARE_LINK_VERSION) {
    const newer =
      version > SHARE_LINK_VERSION ? ' It was made by a newer Trueturn: update this app.' : '';
    return {
      ok: false,
      error: `This share link is version ${version}; this app reads versions ${OLDEST_SHARE_LINK_VERSION} to ${SHARE_LINK_VERSION}.${newer}`,
    };
  }
  const bytes = fromBase64Url(m[2]);
  if (!bytes) return { ok: false, error: BROKEN };
  let parsed: unknown;
  try {
    parsed = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch {
    return { ok: false, error: BROKEN };
  }
  try {
    if (version === 1) {
      const setup = validateSetup(parsed, 'link');
      return { ok: true, content: { ...blankHeader(), setup, tools: defaultToolInputs() } };
    }
    return { ok: true, content: validateContent(parsed, 'link') };
  } catch (e) {
    if (e instanceof DataError)
      return { ok: false, error: `This share link was refused: ${e.message}` };
    return { ok: false, error: BROKEN };
  }
}

/** The value of `s=` among "&"-separated fields, or null when there is none. */
function findField(fragment: string): string | null {
  for (const part of fragment.split('&')) {
    if (part.startsWith(`${FIELD}=`)) return part.slice(FIELD.length + 1);
  }
  return null;
}

/** RFC 4648 §5 base64url, without padding. */
function toBase64Url(bytes: Uint8Array): string {
  let binary = '';
  // In chunks: String.fromCharCode with a huge argument list can overflow the call stack.
  for (let i = 0; i < bytes.length; i += 0x8000) {
    binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  }
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

/**
 * Bytes from unpadded base64url, or null for text that cannot be base64url (atob refuses, among
 * others, a length of 4k + 1, which no byte string gives: the link was cut).
 */
function fromBase64Url(text: string): Uint8Array | null {
  const padded =
    text.replace(/-/g, '+').replace(/_/g, '/') + '='.repeat((4 - (text.length % 4)) % 4);
  let binary: string;
  try {
    binary = atob(padded);
  } catch {
    return null;
  }
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}
