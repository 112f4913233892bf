import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import {
  blankHeader,
  defaultSetup,
  defaultToolInputs,
  type MachineContent,
  type PartSpec,
  type Setup,
} from '../../src/state/model';
import {
  decodeShareFragment,
  encodeShareFragment,
  MAX_FRAGMENT_CHARS,
  MAX_SHARE_CHARS,
  SHARE_LINK_VERSION,
} from '../../src/state/shareLink';
import { DataError } from '../../src/state/validate';
import { prototypeIsClean, sampleContent, sampleSetup } from './fixtures';

/** A machine's content holding `setup`, as the working copy would. */
const holding = (setup: Setup): MachineContent => sampleContent({ setup });

// Node's own base64url codec (RFC 4648 §5), an independent check of ours. Typed by hand: the
// project's type-check does not load Node's types.
const NodeBuffer = (
  globalThis as unknown as {
    Buffer: { from(data: string, encoding: string): { toString(encoding: string): string } };
  }
).Buffer;

/** A fragment carrying `json` exactly as given, encoded by Node rather than by us. */
function fragmentOf(json: string, version = SHARE_LINK_VERSION): string {
  return `#s=${version}.${NodeBuffer.from(json, 'utf8').toString('base64url')}`;
}

const BROKEN = 'This share link is damaged or cut short; ask for the link again.';

describe('encodeShareFragment', () => {
  it('writes "#s=", the version, a dot and base64url text only', () => {
    expect(encodeShareFragment(holding(defaultSetup))).toMatch(/^#s=2\.[A-Za-z0-9_-]+$/);
  });

  it('carries the whole machine, name, site and tools included, as UTF-8 JSON that Node decodes to the same text', () => {
    const content = sampleContent({ name: 'Lüfter Ø 300 — 風扇', site: 'Halle 2' });
    content.tools.logger.sampleHz = 2000;
    const payload = encodeShareFragment(content).slice('#s=2.'.length);
    expect(JSON.parse(NodeBuffer.from(payload, 'base64url').toString('utf8'))).toEqual(content);
  });

  it('keeps a typical machine well under the size limit', () => {
    expect(encodeShareFragment(sampleContent()).length).toBeLessThan(2500);
  });

  it('refuses an invalid set-up', () => {
    const s = sampleSetup();
    s.parts[0].features = 0;
    expect(() => encodeShareFragment(holding(s))).toThrow(DataError);
  });

  it('refuses a set-up too large for a link', () => {
    const part: PartSpec = {
      name: '€'.repeat(80),
      speedRpm: 1450,
      features: 8,
      tolerancePercent: 1,
    };
    const big: Setup = { ...sampleSetup(), parts: Array.from({ length: 20 }, () => ({ ...part })) };
    expect(() => encodeShareFragment(holding(big))).toThrow(
      'This machine is too large to share as a link',
    );
  });
});

describe('decodeShareFragment', () => {
  it('gets back exactly the machine that was encoded', () => {
    for (const content of [holding(defaultSetup), sampleContent()]) {
      expect(decodeShareFragment(encodeShareFragment(content))).toEqual({ ok: true, content });
    }
  });

  it('still opens a version 1 link, which carried a set-up only, with a blank name and tools at their start', () => {
    expect(decodeShareFragment(fragmentOf(JSON.stringify(sampleSetup()), 1))).toEqual({
      ok: true,
      content: { ...blankHeader(), setup: sampleSetup(), tools: defaultToolInputs() },
    });
  });

  it('reads a fragment without "#" and among other fields', () => {
    const payload = encodeShareFragment(sampleContent()).slice(1);
    expect(decodeShareFragment(payload).ok).toBe(true);
    expect(decodeShareFragment(`#view=chart&${payload}&x=1`)).toEqual({
      ok: true,
      content: sampleContent(),
    });
  });

  it('reports no share data (error null) when the fragment carries none', () => {
    for (const hash of ['', '#', '#about', '#view=chart&x=1', '#ss=1.abc']) {
      expect(decodeShareFragment(hash)).toEqual({ ok: false, error: null });
    }
  });

  it('refuses a link cut short at any point', () => {
    const fragment = encodeShareFragment(sampleContent());
    for (let end = '#s='.length; end < fragment.length; end++) {
      const r = decodeShareFragment(fragment.slice(0, end));
      expect(r.ok).toBe(false);
      expect(typeof (r as { error: unknown }).error).toBe('string');
    }
  });

  it('refuses characters that base64url does not use', () => {
    const fragment = encodeShareFragment(sampleContent());
    expect(decodeShareFragment(fragment.slice(0, 20) + '+/=' + fragment.slice(20))).toEqual({
      ok: false,
      error: BROKEN,
    });
    expect(decodeShareFragment('#s=1.<script>')).toEqual({ ok: false, error: BROKEN });
    expect(decodeShareFragment('#s=1.')).toEqual({ ok: false, error: BROKEN });
    expect(decodeShareFragment('#s=abc')).toEqual({ ok: false, error: BROKEN });
  });

  it('refuses bytes that are not UTF-8 text, and text that is not JSON', () => {
    // 0xFF never occurs in UTF-8 (RFC 3629 §1); "__8" is base64url for the bytes FF FF.
    expect(decodeShareFragment('#s=1.__8')).toEqual({ ok: false, error: BROKEN });
    expect(decodeShareFragment(fragmentOf('{"parts": ['))).toEqual({ ok: false, error: BROKEN });
  });

  it('refuses a tampered set-up with the field that is wrong', () => {
    const tampered = JSON.stringify(sampleContent()).replace('"features":12', '"features":-12');
    expect(decodeShareFragment(fragmentOf(tampered))).toEqual({
      ok: false,
      error:
        'This share link was refused: link › parts › 2 › features must be a whole number from 1 to 100000 (got -12).',
    });
    const extra = JSON.stringify({ ...sampleContent(), script: 'alert(1)' });
    expect(decodeShareFragment(fragmentOf(extra))).toEqual({
      ok: false,
      error: 'This share link was refused: link has a field this app does not know: "script".',
    });
  });

  it('refuses hostile keys and pollutes nothing', () => {
    const hostile = JSON.stringify(sampleContent()).replace('{', '{"__proto__":{"polluted":true},');
    expect(decodeShareFragment(fragmentOf(hostile))).toEqual({
      ok: false,
      error:
        'This share link was refused: link contains a field called "__proto__", which is never allowed in Trueturn data.',
    });
    const inPart = JSON.stringify(sampleContent()).replace(
      '"name":"Motor"',
      '"constructor":{"prototype":{"polluted":true}},"name":"Motor"',
    );
    expect(decodeShareFragment(fragmentOf(inPart)).ok).toBe(false);
    expect(prototypeIsClean()).toBe(true);
  });

  it(`refuses a payload over ${MAX_SHARE_CHARS} characters without decoding it`, () => {
    expect(decodeShareFragment(`#s=1.${'A'.repeat(MAX_SHARE_CHARS)}`)).toEqual({
      ok: false,
      error: 'This share link is too long to be a Trueturn link; it was not opened.',
    });
  });

  it('refuses a 1 MB link by its length alone, before splitting, matching or decoding it', () => {
    const huge = `#s=1.${'A'.repeat(1024 * 1024)}`;
    const work = [
      vi.spyOn(String.prototype, 'split'),
      vi.spyOn(String.prototype, 'slice'),
      vi.spyOn(RegExp.prototype, 'exec'),
      vi.spyOn(globalThis, 'atob'),
      vi.spyOn(JSON, 'parse'),
    ];
    let result;
    let calls: number[];
    try {
      result = decodeShareFragment(huge);
    } finally {
      calls = work.map((spy) => spy.mock.calls.length);
      for (const spy of work) spy.mockRestore();
    }
    expect(result).toEqual({
      ok: false,
      error: 'This share link is too long to be a Trueturn link; it was not opened.',
    });
    // split, slice, exec, atob, JSON.parse: none ran.
    expect(calls).toEqual([0, 0, 0, 0, 0]);
  });

  it(`still reads a good link among other fields, up to ${MAX_FRAGMENT_CHARS} characters in all`, () => {
    const good = encodeShareFragment(sampleContent()).slice(1);
    const padded = `#${good}&note=${'x'.repeat(MAX_FRAGMENT_CHARS - good.length - 7)}`;
    expect(padded.length).toBe(MAX_FRAGMENT_CHARS);
    expect(decodeShareFragment(padded)).toEqual({ ok: true, content: sampleContent() });
    expect(decodeShareFragment(padded + 'x').ok).toBe(false);
  });

  it('refuses a link from a newer version and says which version it reads', () => {
    expect(decodeShareFragment(fragmentOf(JSON.stringify(sampleContent()), 3))).toEqual({
      ok: false,
      error:
        'This share link is version 3; this app reads versions 1 to 2. It was made by a newer Trueturn: update this app.',
    });
    expect(decodeShareFragment(fragmentOf('{}', 0))).toEqual({
      ok: false,
      error: 'This share link is version 0; this app reads versions 1 to 2.',
    });
  });

  it('hands back markup in a name as the same plain text, for callers to show as text', () => {
    const c = sampleContent({ name: '<b>Fan</b>' });
    c.setup.parts[0].name = '<img src=x onerror=alert(1)>';
    const r = decodeShareFragment(encodeShareFragment(c));
    expect(r.ok && r.content.setup.parts[0].name).toBe('<img src=x onerror=alert(1)>');
    expect(r.ok && r.content.name).toBe('<b>Fan</b>');
  });

  it('never throws, whatever the fragment', () => {
    fc.assert(
      fc.property(fc.string(), fc.base64String(), (text, b64) => {
        for (const hash of [text, `#s=${text}`, `#s=1.${b64.replace(/=+$/, '')}`]) {
          const r = decodeShareFragment(hash);
          expect(r.ok === true || r.error === null || typeof r.error === 'string').toBe(true);
        }
      }),
    );
  });
});

describe('share links, for any valid set-up', () => {
  // Whole-range numbers; -0 would come back as 0 through JSON, so it is left out.
  const num = (min: number, max: number) =>
    fc.double({ min, max, noNaN: true }).map((x) => (Object.is(x, -0) ? 0 : x));
  const above0 = (max: number) => fc.double({ min: Number.MIN_VALUE, max, noNaN: true });
  const name = fc
    .string({ unit: 'grapheme', maxLength: 80 })
    .filter(
      (s) =>
        [...s].length <= 80 && !/[\p{Cc}\p{Cs}\u2028\u2029\u202A-\u202E\u2066-\u2069]/u.test(s),
    );
  const part: fc.Arbitrary<PartSpec> = fc.record(
    {
      name,
      speedRpm: num(-1e7, 1e7),
      features: fc.integer({ min: 1, max: 100_000 }),
      tolerancePercent: num(0, 50),
      motor: fc.record({
        mainsHz: fc.constantFrom(50, 60),
        poles: fc.integer({ min: 1, max: 500 }).map((n) => 2 * n),
        slipPercent: num(0, 100),
      }),
    },
    { requiredKeys: ['name', 'speedRpm', 'features', 'tolerancePercent'] },
  );
  const setup: fc.Arbitrary<Setup> = fc
    .record({
      parts: fc.array(part, { minLength: 1, maxLength: 4 }),
      activeSeed: fc.nat(),
      samplerKind: fc.constantFrom('camera', 'strobe', 'lighting' as const),
      frameRate: above0(1e6),
      exposure: fc.oneof(
        above0(360).map((angleDeg) => ({ mode: 'angle' as const, angleDeg })),
        above0(60).map((seconds) => ({ mode: 'time' as const, seconds })),
      ),
      readoutMs: num(0, 1000),
      // Whole numbers keep min < max exact: a tiny gap added to a large min could round away.
      strobeRange: fc.tuple(fc.integer({ min: 1, max: 3e7 }), fc.integer({ min: 1, max: 3e7 })),
      rateFpm: above0(6e7),
      lighting: fc.record({
        mainsHz: fc.constantFrom(50, 60 as const),
        flicker: fc.constantFrom('double', 'mains', 'custom' as const),
        customHz: above0(1e6),
        modulationPercent: num(0, 100),
      }),
      creepRpm: num(-1e7, 1e7),
    })
    .map((r) => ({
      parts: r.parts,
      activePart: r.activeSeed % r.parts.length,
      samplerKind: r.samplerKind,
      camera: { frameRate: r.frameRate, exposure: r.exposure, readoutMs: r.readoutMs },
      strobe: {
        rateFpm: r.rateFpm,
        minFpm: r.strobeRange[0],
        maxFpm: r.strobeRange[0] + r.strobeRange[1],
      },
      lighting: r.lighting,
      creepRpm: r.creepRpm,
    }));

  it('decoding an encoded set-up gives it back unchanged', () => {
    fc.assert(
      fc.property(setup, (s) => {
        expect(decodeShareFragment(encodeShareFragment(holding(s)))).toEqual({
          ok: true,
          content: holding(s),
        });
      }),
      { numRuns: 300 },
    );
  });
});
