import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lightingCheck, type Lamp } from '../../../src/core/plans/lightingCheck';
import { anyFinite, bad, expectInputError, finiteOrInputError } from '../expectInputError';

/**
 * Visibility threshold of the SVM (CIE TN 006:2016): the power fit T(f) = 2.865e-5·f^1.543 + 0.225
 * of Perz et al., JOSA A 35(2):309 (2018), written out.
 */
const T = (f: number) => 2.865e-5 * Math.pow(f, 1.543) + 0.225;

// IEC 60034-1: a 2-pole motor on 50 Hz is 3000 rpm synchronous; a two-jaw chuck on it passes
// 2·50 = 100 jaws a second, exactly the 100 Hz flicker of lamps on 50 Hz mains.
const chuck = { name: 'chuck', speedHz: 50, symmetry: 2 };
const lamp50: Lamp = { mainsHz: 50, flicker: 'double', modulationPercent: 30 };

describe('lightingCheck: how the machine looks under a flickering lamp', () => {
  it('flags a two-jaw chuck at synchronous speed as standing still under 100 Hz flicker: a hazard', () => {
    const check = lightingCheck(lamp50, [chuck]);
    expect(check.flickerHz).toBe(100);
    const [row] = check.parts;
    expect(row).toMatchObject({
      look: 'still',
      worstLook: 'still',
      images: 1,
      misleading: true,
      hazard: true,
      verdict: 'hazard',
    });
    expect(row.speedHz).toBe(50);
    expect(check.verdict).toBe('hazard');
  });

  it('gives the IEEE 1789 lines and the CIE SVM of the 100 Hz component', () => {
    // IEEE Std 1789-2015 at 100 Hz: low risk 0.08·100 = 8 %, no observable effect 0.0333·100 = 3.33 %.
    const check = lightingCheck(lamp50, [chuck]);
    expect(check.lowRiskPercent).toBeCloseTo(8, 12);
    expect(check.noEffectPercent).toBeCloseTo(3.33, 12);
    expect(check.risk).toBe('elevated'); // 30 % > 8 %
    // CIE TN 006:2016: SVM = C/T(f), C = 0.30: 0.30/0.25992 = 1.154, above the threshold 1.
    expect(check.svm).toBeCloseTo(0.3 / T(100), 12);
    expect(check.svm).toBeCloseTo(1.154, 3);
    expect(check.visible).toBe(true);
  });

  it('shows the chuck at its typical full-load 2900 rpm creeping backward at 100 rpm', () => {
    // Engineering ToolBox: 2900 rpm typical for 2 poles at 50 Hz. Pattern 2·2900/60 = 96.67 Hz;
    // r = 0.9667, step −1/30 pitch, apparent −(1/30)·100/2 rev/s = −100 rpm (docs/physics.md §2).
    const [row] = lightingCheck(lamp50, [{ name: 'chuck', speedHz: 2900 / 60, symmetry: 2 }]).parts;
    expect(row.look).toBe('backward');
    expect(row.apparentRpm).toBeCloseTo(-100, 9);
    expect(row.hazard).toBe(true);
    expect(row.worstLook).toBe('backward');
  });

  it('freezes a 4-blade fan on a 4-pole 60 Hz motor at synchronous speed under 120 Hz flicker', () => {
    // IEC 60034-1 / NEMA MG 1: 1800 rpm = 30 rev/s; 4 blades pass 120 times a second = 2·60 Hz.
    const check = lightingCheck({ mainsHz: 60, flicker: 'double', modulationPercent: 30 }, [
      { name: 'fan', speedHz: 30, symmetry: 4 },
    ]);
    expect(check.flickerHz).toBe(120);
    expect(check.parts[0].worstLook).toBe('still');
    // IEEE Std 1789-2015 at 120 Hz: 0.08·120 = 9.6 %, 0.0333·120 = 3.996 %.
    expect(check.lowRiskPercent).toBeCloseTo(9.6, 12);
    expect(check.noEffectPercent).toBeCloseTo(3.996, 12);
  });

  it('finds the still look anywhere within the speed tolerance, not only at the nominal speed', () => {
    // 2990 rpm ± 1 %: the jaw rate 99.67 Hz ± 1 % passes 100 Hz.
    const [row] = lightingCheck(lamp50, [
      { name: 'chuck', speedHz: 2990 / 60, symmetry: 2, tolerance: 0.01 },
    ]).parts;
    expect(row.look).toBe('backward');
    expect(row.worstLook).toBe('still');
  });

  it('calls a misleading look under flicker below the visibility threshold a caution, not a hazard', () => {
    // 3 % at 100 Hz: under the 3.33 % no-effect line; SVM = 0.03/T(100) = 0.115.
    const check = lightingCheck({ ...lamp50, modulationPercent: 3 }, [chuck]);
    expect(check.risk).toBe('no-effect');
    expect(check.svm).toBeCloseTo(0.03 / T(100), 12);
    expect(check.visible).toBe(false);
    expect(check.parts[0]).toMatchObject({
      worstLook: 'still',
      misleading: true,
      hazard: false,
      verdict: 'caution',
    });
    expect(check.verdict).toBe('caution');
    expect(check.remedies.length).toBeGreaterThan(0);
  });

  it('passes a slow roller that shows its true speed under low flicker', () => {
    // One mark at 30 rpm under 100 Hz: 0.5 rev/s, far below the Nyquist limit of 50 rev/s.
    const check = lightingCheck({ ...lamp50, modulationPercent: 3 }, [
      { name: 'roller', speedHz: 0.5, symmetry: 1 },
    ]);
    expect(check.parts[0]).toMatchObject({ look: 'true', worstLook: 'true', verdict: 'fine' });
    expect(check.verdict).toBe('fine');
    expect(check.remedies).toEqual([]);
  });

  it('sees nothing misleading when the light does not flicker: at 0 % nothing looks still', () => {
    // Steady light samples nothing (docs/physics.md §6): the chuck that stands still at 30 % shows its true motion.
    const check = lightingCheck({ ...lamp50, modulationPercent: 0 }, [chuck]);
    expect(check.svm).toBe(0);
    expect(check.parts[0]).toMatchObject({
      look: 'true',
      worstLook: 'true',
      apparentRpm: 3000,
      misleading: false,
      aliased: false,
      hazard: false,
      verdict: 'fine',
    });
    expect(check.verdict).toBe('fine');
    expect(check.modulationPercent).toBe(0);
    expect(check.cautions).toEqual(['planning-aid']);
  });

  it('recommends high-frequency drivers, lamps on different phases, task lighting and local rules', () => {
    const { remedies, cautions } = lightingCheck(lamp50, [chuck]);
    expect(remedies).toEqual(['steady-drivers', 'split-phases', 'task-lamp', 'local-rules']);
    expect(cautions).toContain('stillness');
  });

  it('flickers at the mains frequency when asked, and warns about flashing in the seizure range', () => {
    // IEEE Std 1789-2015 below 90 Hz: 0.025·50 = 1.25 %, 0.01·50 = 0.5 %. WCAG 2.x 2.3.1 / docs/physics.md §10: 3–60 Hz.
    const check = lightingCheck({ mainsHz: 50, flicker: 'mains', modulationPercent: 30 }, [chuck]);
    expect(check.flickerHz).toBe(50);
    expect(check.lowRiskPercent).toBeCloseTo(1.25, 12);
    expect(check.noEffectPercent).toBeCloseTo(0.5, 12);
    expect(check.cautions).toContain('flashing');
  });

  it('takes a custom flicker frequency and then suggests changing the dimmer rather than the phases', () => {
    const check = lightingCheck({ mainsHz: 50, flicker: 300, modulationPercent: 100 }, [
      { name: 'spindle', speedHz: 50, symmetry: 6 },
    ]);
    expect(check.flickerHz).toBe(300);
    expect(check.parts[0].worstLook).toBe('still'); // 6·50 = 300 features a second
    expect(check.remedies).toContain('faster-dimmer');
    expect(check.remedies).not.toContain('split-phases');
  });
});

describe('lightingCheck: bad input', () => {
  it('rejects mains other than 50 or 60 Hz and an unknown flicker', () => {
    expectInputError(
      () => lightingCheck({ ...lamp50, mainsHz: 55 }, [chuck]),
      'mains frequency',
      '50 or 60',
    );
    expectInputError(
      () => lightingCheck({ ...lamp50, flicker: bad('triple') }, [chuck]),
      'flicker',
    );
    expectInputError(() => lightingCheck({ ...lamp50, flicker: 0 }, [chuck]), 'flicker frequency');
    expectInputError(() => lightingCheck(bad(null), [chuck]), 'lamp', 'mains');
  });

  it('rejects a modulation outside 0 to 100 percent', () => {
    expectInputError(
      () => lightingCheck({ ...lamp50, modulationPercent: 120 }, [chuck]),
      'modulation (percent flicker)',
    );
    expectInputError(
      () => lightingCheck({ ...lamp50, modulationPercent: NaN }, [chuck]),
      'modulation (percent flicker)',
    );
  });

  it('rejects no parts, a bad part and bad look options', () => {
    expectInputError(() => lightingCheck(lamp50, []), 'parts', 'part');
    expectInputError(
      () => lightingCheck(lamp50, [{ speedHz: 50, symmetry: 0 }]),
      'features (blades, spokes)',
    );
    expectInputError(() => lightingCheck(lamp50, [chuck], { stillHz: -1 }), 'still threshold');
  });
});

describe('lightingCheck: never NaN or Infinity', () => {
  it('returns finite numbers or throws InputError for any part and flicker', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        fc.integer({ min: 1, max: 100_000 }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.oneof(fc.constantFrom<'double' | 'mains'>('double', 'mains'), anyFinite()),
        anyFinite(),
        (speedHz, symmetry, tolerance, flicker, modulationPercent) =>
          finiteOrInputError(() =>
            lightingCheck({ mainsHz: 60, flicker, modulationPercent }, [
              { speedHz, symmetry, tolerance },
            ]),
          ),
      ),
      { seed: 1949, numRuns: 500 },
    );
  });
});

describe('lightingCheck: the lamp’s waveform', () => {
  it('counts a PWM lamp’s harmonics: a 50 % square wave at 25 % flicker is visible where a sine is not', () => {
    // Sine: SVM = 0.25/T(100) = 0.96 < 1. Square wave of the same percent flicker: C_m = 4·0.25/(mπ)
    // for odd m (Fourier series of a rectangular pulse train), combined to 2 kHz with exponent 3.7.
    const sine = lightingCheck({ ...lamp50, modulationPercent: 25 }, [chuck]);
    expect(sine.svm).toBeCloseTo(0.25 / T(100), 12);
    expect(sine.visible).toBe(false);
    expect(sine.parts[0].verdict).toBe('caution');
    const square = lightingCheck(
      { ...lamp50, modulationPercent: 25, waveform: { shape: 'rectangular', dutyCycle: 0.5 } },
      [chuck],
    );
    let sum = 0;
    for (let m = 1; m <= 20; m += 2) sum += Math.pow((4 * 0.25) / (m * Math.PI) / T(100 * m), 3.7);
    expect(square.svm).toBeCloseTo(Math.pow(sum, 1 / 3.7), 12);
    expect(square.visible).toBe(true);
    expect(square.parts[0].verdict).toBe('hazard');
    expect(square.harmonics).toHaveLength(20);
  });

  it('gives a plain driver’s rectified light its 2/3 fundamental at full flicker', () => {
    // |sin x| = 2/π − (4/π)·Σ cos(2kx)/(4k² − 1): C₁ = (4/3π)/(2/π) = 2/3 at 100 Hz.
    const check = lightingCheck(
      { ...lamp50, modulationPercent: 100, waveform: { shape: 'rectified' } },
      [chuck],
    );
    expect(check.harmonics[0]).toEqual({ frequencyHz: 100, amplitude: expect.closeTo(2 / 3, 12) });
  });

  it('carries the stillness caution for a part that only seems slower under the flicker', () => {
    // docs/physics.md §4: a slowed forward view is aliased too. One mark at 101 rev/s under 100 Hz
    // flicker: r = 1.01, e = +0.01 pitch, a = 0.01·100 = 1 rev/s forward (docs/physics.md §2).
    const creep = lightingCheck(lamp50, [{ name: 'disc', speedHz: 101, symmetry: 1 }]);
    expect(creep.parts[0].look).toBe('forward');
    expect(creep.parts[0].misleading).toBe(false);
    expect(creep.parts[0].aliased).toBe(true);
    expect(creep.cautions).toContain('stillness');
  });
});
