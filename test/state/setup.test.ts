import { beforeEach, describe, expect, test } from 'vitest';
import { defaultSetup } from '../../src/state/model';
import {
  activePart,
  flickerHzOf,
  replaceSetup,
  samplerRateHz,
  setExposureSeconds,
  setFeatures,
  setMotor,
  setSamplerKind,
  setSamplerRateHz,
  setShutterAngle,
  setSpeedRpm,
  setStrobeRange,
  setup,
} from '../../src/state/setup';

beforeEach(() => {
  replaceSetup(defaultSetup);
});

describe('field setters', () => {
  test('each builds a new set-up object and leaves the default untouched', () => {
    const before = setup.value;
    setFeatures(8);
    expect(setup.value).not.toBe(before);
    expect(activePart.value.features).toBe(8);
    expect(defaultSetup.parts[0].features).toBe(6);
  });

  test('a motor gives the speed (1 − slip)·120·fm/P and typing a speed drops the motor', () => {
    // IEC 60034-1 / NEMA MG 1 table: 4 poles on 50 Hz = 1500 rpm synchronous; 1450 rpm at 3.33 % slip.
    setMotor({ mainsHz: 50, poles: 4, slipPercent: (1 - 1450 / 1500) * 100 });
    expect(activePart.value.speedRpm).toBeCloseTo(1450, 9);
    expect(activePart.value.motor?.poles).toBe(4);
    setSpeedRpm(1200);
    expect(activePart.value.motor).toBeUndefined();
    expect(activePart.value.speedRpm).toBe(1200);
  });

  test('a motor keeps the direction the part had', () => {
    setSpeedRpm(-100);
    // 2 poles on 60 Hz = 3600 rpm synchronous (IEC 60034-1 / NEMA MG 1 table).
    setMotor({ mainsHz: 60, poles: 2, slipPercent: 0 });
    expect(activePart.value.speedRpm).toBeCloseTo(-3600, 9);
  });

  test('switching exposure between angle and time keeps the values given', () => {
    setShutterAngle(172.8);
    expect(setup.value.camera.exposure).toEqual({ mode: 'angle', angleDeg: 172.8 });
    setExposureSeconds(1 / 50);
    expect(setup.value.camera.exposure).toEqual({ mode: 'time', seconds: 1 / 50 });
  });

  test('the strobe range is set as a pair', () => {
    setStrobeRange(100, 5000);
    expect(setup.value.strobe).toMatchObject({ minFpm: 100, maxFpm: 5000 });
  });
});

describe('the sampler rate', () => {
  test('is read in Hz from whichever sampler is chosen', () => {
    expect(samplerRateHz(setup.value)).toBeCloseTo(1770 / 60, 12);
    setSamplerKind('camera');
    expect(samplerRateHz(setup.value)).toBeCloseTo(30000 / 1001, 12);
    setSamplerKind('lighting');
    // Lighting on 50 Hz mains flickers at twice mains, 100 Hz (docs/physics.md §6).
    expect(samplerRateHz(setup.value)).toBe(100);
  });

  test('tapping a rate sets the chosen sampler: fpm for a strobe, fps for a camera, a custom flicker for lighting', () => {
    setSamplerRateHz(30);
    expect(setup.value.strobe.rateFpm).toBe(1800);
    setSamplerKind('camera');
    setSamplerRateHz(25);
    expect(setup.value.camera.frameRate).toBe(25);
    setSamplerKind('lighting');
    setSamplerRateHz(240);
    expect(setup.value.lighting.flicker).toBe('custom');
    expect(flickerHzOf(setup.value.lighting)).toBe(240);
  });

  test('ignores a rate that is not a positive number', () => {
    const before = setup.value;
    setSamplerRateHz(NaN);
    setSamplerRateHz(-1);
    setSamplerRateHz(0);
    expect(setup.value).toBe(before);
  });
});
