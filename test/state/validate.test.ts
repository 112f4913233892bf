import { describe, expect, it } from 'vitest';
import { defaultSetup } from '../../src/state/model';
import {
  DataError,
  validateMachine,
  validateMachineName,
  validateSetup,
} from '../../src/state/validate';
import { bent, prototypeIsClean, sampleMachine, sampleSetup } from './fixtures';

/** The DataError that `fn` throws (fails the test if it throws nothing or something else). */
function dataErrorOf(fn: () => unknown): DataError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(DataError);
    return e as DataError;
  }
  throw new Error('expected a DataError, but nothing was thrown');
}

describe('validateSetup', () => {
  it('accepts the default set-up and returns an equal copy that shares no objects with it', () => {
    const copy = validateSetup(defaultSetup);
    expect(copy).toEqual(defaultSetup);
    expect(copy).not.toBe(defaultSetup);
    expect(copy.parts).not.toBe(defaultSetup.parts);
    expect(copy.parts[0]).not.toBe(defaultSetup.parts[0]);
    expect(copy.camera.exposure).not.toBe(defaultSetup.camera.exposure);
  });

  it('accepts a set-up with a motor-driven part, a negative speed and a time exposure', () => {
    const s = sampleSetup();
    s.camera.exposure = { mode: 'time', seconds: 1 / 500 };
    expect(validateSetup(s)).toEqual(s);
  });

  it('treats an optional motor stored as undefined as absent', () => {
    const s = sampleSetup();
    s.parts[1].motor = undefined;
    const out = validateSetup(s);
    expect('motor' in out.parts[1]).toBe(false);
  });

  it('reads a lighting set-up without a waveform as the sine older set-ups assumed, and keeps a given one', () => {
    const s = sampleSetup();
    expect('waveform' in validateSetup(s).lighting).toBe(false);
    s.lighting = { ...s.lighting, waveform: 'rectangular', dutyPercent: 12.5 };
    expect(validateSetup(s).lighting).toEqual(s.lighting);
    s.lighting = { ...s.lighting, waveform: 'rectified' };
    expect(validateSetup(s).lighting.waveform).toBe('rectified');
  });

  it('accepts the edges of every range', () => {
    const s = sampleSetup();
    s.parts[0] = { name: '', speedRpm: -1e7, features: 100_000, tolerancePercent: 50 };
    s.parts[1] = { name: 'x'.repeat(80), speedRpm: 1e7, features: 1, tolerancePercent: 0 };
    s.camera = { frameRate: 1e6, exposure: { mode: 'angle', angleDeg: 360 }, readoutMs: 1000 };
    s.lighting = { mainsHz: 60, flicker: 'custom', customHz: 1e6, modulationPercent: 100 };
    s.strobe = { rateFpm: 0.5, minFpm: 0.5, maxFpm: 0.6 };
    expect(validateSetup(s)).toEqual(s);
  });

  // Each row: what is wrong, how to break a valid set-up, and the message expected in full.
  const rejections: Array<[string, (s: any) => void, string]> = [
    [
      'a fractional feature count',
      (s) => (s.parts[0].features = 2.5),
      'set-up › parts › 1 › features must be a whole number from 1 to 100000 (got 2.5).',
    ],
    [
      'zero features',
      (s) => (s.parts[1].features = 0),
      'set-up › parts › 2 › features must be a whole number from 1 to 100000 (got 0).',
    ],
    [
      'too many features',
      (s) => (s.parts[1].features = 100_001),
      'set-up › parts › 2 › features must be a whole number from 1 to 100000 (got 100001).',
    ],
    [
      'a speed given as text',
      (s) => (s.parts[0].speedRpm = '1450'),
      'set-up › parts › 1 › speedRpm must be a number (got the text "1450").',
    ],
    [
      'a speed beyond 1e7 rpm',
      (s) => (s.parts[0].speedRpm = -1.0000001e7),
      'set-up › parts › 1 › speedRpm must be a number from -10000000 to 10000000 (got -10000001).',
    ],
    [
      'a speed of null (what JSON makes of NaN)',
      (s) => (s.parts[0].speedRpm = null),
      'set-up › parts › 1 › speedRpm must be a number (got null).',
    ],
    [
      'a tolerance over 50 %',
      (s) => (s.parts[0].tolerancePercent = 50.5),
      'set-up › parts › 1 › tolerancePercent must be a number from 0 to 50 (got 50.5).',
    ],
    [
      'a negative tolerance',
      (s) => (s.parts[0].tolerancePercent = -1),
      'set-up › parts › 1 › tolerancePercent must be a number from 0 to 50 (got -1).',
    ],
    [
      'an odd number of poles',
      (s) => (s.parts[0].motor.poles = 3),
      'set-up › parts › 1 › motor › poles must be even: poles come in pairs (got 3).',
    ],
    [
      'mains of 55 Hz on a motor',
      (s) => (s.parts[0].motor.mainsHz = 55),
      'set-up › parts › 1 › motor › mainsHz must be one of 50, 60 (got 55).',
    ],
    [
      'a slip over 100 %',
      (s) => (s.parts[0].motor.slipPercent = 101),
      'set-up › parts › 1 › motor › slipPercent must be a number from 0 to 100 (got 101).',
    ],
    [
      'a motor without poles',
      (s) => delete s.parts[0].motor.poles,
      'set-up › parts › 1 › motor › poles is missing.',
    ],
    [
      'a part name with a line break',
      (s) => (s.parts[0].name = 'a\nb'),
      'set-up › parts › 1 › name must be plain text on one line, without control or direction characters.',
    ],
    [
      'a part name with a right-to-left override',
      (s) => (s.parts[0].name = 'fan\u202Egnp.exe'),
      'set-up › parts › 1 › name must be plain text on one line, without control or direction characters.',
    ],
    [
      'a part name of 81 characters',
      (s) => (s.parts[0].name = 'é'.repeat(81)),
      'set-up › parts › 1 › name must be at most 80 characters (it has 81).',
    ],
    [
      'a part name that is a number',
      (s) => (s.parts[0].name = 7),
      'set-up › parts › 1 › name must be text (got 7).',
    ],
    ['no parts', (s) => (s.parts = []), 'set-up › parts must hold 1 to 20 parts (it holds 0).'],
    [
      '21 parts',
      (s) => (s.parts = Array.from({ length: 21 }, () => s.parts[0])),
      'set-up › parts must hold 1 to 20 parts (it holds 21).',
    ],
    [
      'parts given as an object',
      (s) => (s.parts = { 0: s.parts[0] }),
      'set-up › parts must be a list […] (got a group of fields).',
    ],
    [
      'a part that is a list',
      (s) => (s.parts[0] = [1]),
      'set-up › parts › 1 must be a group of fields {…} (got a list).',
    ],
    [
      'an active part past the end',
      (s) => (s.activePart = 2),
      'set-up › activePart must pick one of the 2 parts: a whole number from 0 to 1 (got 2).',
    ],
    [
      'a fractional active part',
      (s) => (s.activePart = 0.5),
      'set-up › activePart must pick one of the 2 parts: a whole number from 0 to 1 (got 0.5).',
    ],
    [
      'an unknown sampler',
      (s) => (s.samplerKind = 'laser'),
      'set-up › samplerKind must be one of "camera", "strobe", "lighting" (got the text "laser").',
    ],
    [
      'a frame rate of zero',
      (s) => (s.camera.frameRate = 0),
      'set-up › camera › frameRate must be a number above 0 and at most 1000000 (got 0).',
    ],
    [
      'a frame rate over a million',
      (s) => (s.camera.frameRate = 1e6 + 1),
      'set-up › camera › frameRate must be a number above 0 and at most 1000000 (got 1000001).',
    ],
    [
      'a shutter angle of 0°',
      (s) => (s.camera.exposure.angleDeg = 0),
      'set-up › camera › exposure › angleDeg must be a number above 0 and at most 360 (got 0).',
    ],
    [
      'a shutter angle over 360°',
      (s) => (s.camera.exposure.angleDeg = 361),
      'set-up › camera › exposure › angleDeg must be a number above 0 and at most 360 (got 361).',
    ],
    [
      'an exposure time of zero',
      (s) => (s.camera.exposure = { mode: 'time', seconds: 0 }),
      'set-up › camera › exposure › seconds must be a number above 0 and at most 60 (got 0).',
    ],
    [
      'an angle exposure that also carries seconds',
      (s) => (s.camera.exposure.seconds = 0.01),
      'set-up › camera › exposure has a field this app does not know: "seconds".',
    ],
    [
      'an exposure mode that is unknown',
      (s) => (s.camera.exposure = { mode: 'auto' }),
      'set-up › camera › exposure › mode must be one of "angle", "time" (got the text "auto").',
    ],
    [
      'a readout over 1000 ms',
      (s) => (s.camera.readoutMs = 1001),
      'set-up › camera › readoutMs must be a number from 0 to 1000 (got 1001).',
    ],
    [
      'a negative readout',
      (s) => (s.camera.readoutMs = -1),
      'set-up › camera › readoutMs must be a number from 0 to 1000 (got -1).',
    ],
    [
      'a strobe rate of zero',
      (s) => (s.strobe.rateFpm = 0),
      'set-up › strobe › rateFpm must be a number above 0 and at most 60000000 (got 0).',
    ],
    [
      'a strobe range with min equal to max',
      (s) => (s.strobe.minFpm = s.strobe.maxFpm),
      'set-up › strobe › maxFpm must be above minFpm (got 12000 to 12000).',
    ],
    [
      'a strobe range upside down',
      (s) => Object.assign(s.strobe, { minFpm: 500, maxFpm: 100 }),
      'set-up › strobe › maxFpm must be above minFpm (got 500 to 100).',
    ],
    [
      'mains of 400 Hz',
      (s) => (s.lighting.mainsHz = 400),
      'set-up › lighting › mainsHz must be one of 50, 60 (got 400).',
    ],
    [
      'mains given as text',
      (s) => (s.lighting.mainsHz = '50'),
      'set-up › lighting › mainsHz must be one of 50, 60 (got the text "50").',
    ],
    [
      'an unknown flicker kind',
      (s) => (s.lighting.flicker = 'triple'),
      'set-up › lighting › flicker must be one of "double", "mains", "custom" (got the text "triple").',
    ],
    [
      'a custom flicker of zero',
      (s) => (s.lighting.customHz = 0),
      'set-up › lighting › customHz must be a number above 0 and at most 1000000 (got 0).',
    ],
    [
      'a modulation over 100 %',
      (s) => (s.lighting.modulationPercent = 100.1),
      'set-up › lighting › modulationPercent must be a number from 0 to 100 (got 100.1).',
    ],
    [
      'an unknown light waveform',
      (s) => (s.lighting.waveform = 'triangle'),
      'set-up › lighting › waveform must be one of "sine", "rectangular", "rectified" (got the text "triangle").',
    ],
    [
      'a PWM duty of 100 %',
      (s) => (s.lighting.dutyPercent = 100),
      'set-up › lighting › dutyPercent must lie between 0 and 100, ends not included (got 100).',
    ],
    [
      'a creep given as a boolean',
      (s) => (s.creepRpm = true),
      'set-up › creepRpm must be a number (got true).',
    ],
    ['a missing lighting', (s) => delete s.lighting, 'set-up › lighting is missing.'],
    [
      'an extra field',
      (s) => (s.colour = 'red'),
      'set-up has a field this app does not know: "colour".',
    ],
    [
      'an extra field in a part',
      (s) => (s.parts[1].diameterMm = 300),
      'set-up › parts › 2 has a field this app does not know: "diameterMm".',
    ],
  ];

  it.each(rejections)('refuses %s with a message naming the field', (_what, breakIt, message) => {
    const e = dataErrorOf(() => validateSetup(bent(sampleSetup(), breakIt)));
    expect(e.message).toBe(message);
    expect(e.name).toBe('DataError');
  });

  it('refuses things that are not a set-up at all', () => {
    for (const x of [null, undefined, 42, 'set-up', [], new Date()]) {
      expect(() => validateSetup(x)).toThrow(DataError);
    }
    expect(dataErrorOf(() => validateSetup('x')).message).toBe(
      'set-up must be a group of fields {…} (got the text "x").',
    );
  });

  it('names the place given by the caller', () => {
    const e = dataErrorOf(() =>
      validateSetup(
        bent(sampleSetup(), (s) => (s.creepRpm = 'x')),
        'link',
      ),
    );
    expect(e.message).toMatch(/^link › creepRpm /);
    expect(e.path).toBe('link › creepRpm');
  });

  it('shows at most 20 characters of a long wrong text', () => {
    const e = dataErrorOf(() =>
      validateSetup(bent(sampleSetup(), (s) => (s.parts[0].speedRpm = 'a'.repeat(500)))),
    );
    expect(e.message).toBe(
      `set-up › parts › 1 › speedRpm must be a number (got the text "${'a'.repeat(20)}"…).`,
    );
  });

  it('refuses NaN and infinities that arrive from code rather than JSON', () => {
    for (const v of [NaN, Infinity, -Infinity]) {
      const s = sampleSetup();
      s.camera.frameRate = v;
      expect(() => validateSetup(s)).toThrow('set-up › camera › frameRate must be a number');
    }
  });

  it('refuses hostile keys and leaves Object.prototype untouched', () => {
    const hostile = [
      '{"__proto__": {"polluted": true}}',
      '{"constructor": {"prototype": {"polluted": true}}}',
      '{"prototype": {"polluted": true}}',
    ];
    for (const extra of hostile) {
      const text = JSON.stringify(sampleSetup()).replace(/^\{/, extra.slice(0, -1) + ',');
      const e = dataErrorOf(() => validateSetup(JSON.parse(text)));
      expect(e.message).toMatch(
        /^set-up contains a field called "(__proto__|constructor|prototype)", which is never allowed/,
      );
      const inPart = JSON.stringify(sampleSetup()).replace(
        '{"name":"Motor"',
        extra.slice(0, -1) + ',"name":"Motor"',
      );
      expect(() => validateSetup(JSON.parse(inPart))).toThrow(/parts › 1 contains a field called/);
    }
    expect(prototypeIsClean()).toBe(true);
  });

  it('refuses objects with another prototype, accessors and symbol keys', () => {
    class FakeSetup {}
    expect(() => validateSetup(Object.assign(new FakeSetup(), sampleSetup()))).toThrow(
      'set-up must be a plain group of fields.',
    );
    const withGetter = sampleSetup() as unknown as Record<string, unknown>;
    Object.defineProperty(withGetter, 'creepRpm', { get: () => 2, enumerable: true });
    expect(() => validateSetup(withGetter)).toThrow('set-up › creepRpm must be plain data.');
    const withSymbol = { ...sampleSetup(), [Symbol('x')]: 1 };
    expect(() => validateSetup(withSymbol)).toThrow('set-up holds a field without a name.');
  });

  it('accepts a prototype-free object', () => {
    const bare = Object.assign(Object.create(null) as object, sampleSetup());
    expect(validateSetup(bare)).toEqual(sampleSetup());
  });
});

describe('validateMachine', () => {
  it('accepts a valid machine and returns an equal, separate copy', () => {
    const m = sampleMachine();
    const out = validateMachine(m);
    expect(out).toEqual(m);
    expect(out.setup).not.toBe(m.setup);
  });

  it('names set-up fields directly under the machine, counting parts from 1', () => {
    const x = bent(sampleMachine(), (m) => (m.setup.parts[0].features = 2.5));
    expect(dataErrorOf(() => validateMachine(x, 'machine 3')).message).toBe(
      'machine 3 › parts › 1 › features must be a whole number from 1 to 100000 (got 2.5).',
    );
  });

  const rejections: Array<[string, (m: any) => void, string]> = [
    ['a blank name', (m) => (m.name = '   '), 'machine › name must not be blank.'],
    [
      'a name of 81 characters',
      (m) => (m.name = 'n'.repeat(81)),
      'machine › name must be at most 80 characters (it has 81).',
    ],
    [
      'a name with a tab',
      (m) => (m.name = 'a\tb'),
      'machine › name must be plain text on one line, without control or direction characters.',
    ],
    [
      'notes of 2001 characters',
      (m) => (m.notes = 'n'.repeat(2001)),
      'machine › notes must be at most 2000 characters (it has 2001).',
    ],
    [
      'notes with a NUL character',
      (m) => (m.notes = 'a\u0000b'),
      'machine › notes must be plain text, without control or direction characters.',
    ],
    ['missing notes', (m) => delete m.notes, 'machine › notes is missing.'],
    [
      'an id with a slash',
      (m) => (m.id = '../x'),
      'machine › id must be 1 to 100 letters, digits, "-" or "_" (got the text "../x").',
    ],
    [
      'an empty id',
      (m) => (m.id = ''),
      'machine › id must be 1 to 100 letters, digits, "-" or "_" (got the text "").',
    ],
    [
      'a numeric id',
      (m) => (m.id = 7),
      'machine › id must be 1 to 100 letters, digits, "-" or "_" (got 7).',
    ],
    [
      'a date without a time zone',
      (m) => (m.createdAt = '2025-03-12T08:30:00'),
      'machine › createdAt must be a date and time such as "2025-03-12T08:30:00Z" (got the text "2025-03-12T08:30:00").',
    ],
    [
      'an impossible date',
      (m) => (m.updatedAt = '2025-13-45T08:30:00Z'),
      'machine › updatedAt must be a date and time such as "2025-03-12T08:30:00Z" (got the text "2025-13-45T08:30:00Z").',
    ],
    [
      'a set-up that is text',
      (m) => (m.setup = 'fan'),
      'machine › setup must be a group of fields {…} (got the text "fan").',
    ],
    [
      'an extra field',
      (m) => (m.favourite = true),
      'machine has a field this app does not know: "favourite".',
    ],
    [
      'a __proto__ field',
      (m) => Object.defineProperty(m, '__proto__', { value: { isAdmin: true }, enumerable: true }),
      'machine contains a field called "__proto__", which is never allowed in Trueturn data.',
    ],
  ];

  it.each(rejections)('refuses %s', (_what, breakIt, message) => {
    expect(dataErrorOf(() => validateMachine(bent(sampleMachine(), breakIt))).message).toBe(
      message,
    );
    expect(prototypeIsClean()).toBe(true);
  });

  it('accepts notes with line breaks and tabs, and dates with an offset', () => {
    const m = sampleMachine({ notes: 'a\r\n\tb', createdAt: '2025-03-12T08:30+01:00' });
    expect(validateMachine(m).notes).toBe('a\r\n\tb');
  });
});

describe('validateMachineName', () => {
  it('returns the name without surrounding spaces', () => {
    expect(validateMachineName('  Cooler fan  ')).toBe('Cooler fan');
  });

  it('refuses a blank name, a name that is not text, and an unpaired surrogate', () => {
    expect(() => validateMachineName('')).toThrow('name must not be blank.');
    expect(() => validateMachineName(null)).toThrow('name must be text (got null).');
    expect(() => validateMachineName('fan \uD800')).toThrow('name must be plain text on one line');
  });
});
