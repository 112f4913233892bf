// The lighting check in words (src/words/lighting.ts): each part, the summary and the remedies
// carry the core's figures.
import { describe, expect, it } from 'vitest';
import { lightingCheck, type Lamp } from '../../src/core';
import { lightingSummary, partWords, remedyWords } from '../../src/words/lighting';

// IEC 60034-1: a 2-pole motor on 50 Hz is 3000 rpm synchronous; a two-jaw chuck on it passes
// 2·50 = 100 jaws a second, exactly the 100 Hz flicker of lamps on 50 Hz mains.
const chuck = { name: 'chuck', speedHz: 50, symmetry: 2 };
const lamp50: Lamp = { mainsHz: 50, flicker: 'double', modulationPercent: 30 };

describe('the lighting check in words', () => {
  it('says the chuck can look still although it turns at 3000 rpm: a hazard', () => {
    const check = lightingCheck(lamp50, [chuck]);
    expect(partWords(check.parts[0], check)).toMatch(
      /^chuck can look still under this light although it turns at 3000 rpm\. Hazard: the flicker is visible \(SVM 1\.15\)\.$/,
    );
    expect(lightingSummary(check)).toMatch(/Hazard: chuck/);
  });

  it('says a chuck at its full-load 2900 rpm can look as if it turns backward', () => {
    // Engineering ToolBox: 2900 rpm typical for 2 poles at 50 Hz.
    const check = lightingCheck(lamp50, [{ name: 'chuck', speedHz: 2900 / 60, symmetry: 2 }]);
    expect(partWords(check.parts[0], check)).toMatch(/look as if it turns backward/);
  });

  it('says so when the flicker is below the threshold, but some people may see it', () => {
    const check = lightingCheck({ ...lamp50, modulationPercent: 3 }, [chuck]);
    expect(partWords(check.parts[0], check)).toMatch(/below the average observer's threshold/);
  });

  it('passes a slow roller that turns the right way', () => {
    const check = lightingCheck({ ...lamp50, modulationPercent: 3 }, [
      { name: 'roller', speedHz: 0.5, symmetry: 1 },
    ]);
    expect(partWords(check.parts[0], check)).toBe('roller turns the right way at its true speed.');
  });

  it('says a steady light does not flicker', () => {
    const check = lightingCheck({ ...lamp50, modulationPercent: 0 }, [chuck]);
    expect(lightingSummary(check)).toMatch(/^The light does not flicker\./);
    expect(partWords(check.parts[0], check)).toBe(
      'chuck: the light does not flicker, so it looks as it is (3000 rpm).',
    );
  });

  it('recommends high-frequency drivers, lamps on different phases, task lighting and local rules', () => {
    const check = lightingCheck(lamp50, [chuck]);
    const text = check.remedies.map((r) => remedyWords(r, check)).join(' ');
    expect(text).toMatch(/high frequency/);
    // IEEE Std 1789-2015 at 100 Hz: the no-observable-effect line is 0.0333·100 = 3.33 %.
    expect(text).toMatch(/no-observable-effect line is 3\.33 %/);
    expect(text).toMatch(/different phases of a three-phase supply/);
    expect(text).toMatch(/task lamp on a steady source/);
    expect(text).toMatch(/Local lighting rules and machinery-safety rules/);
  });

  it("suggests a faster dimmer for a dimmer's own flicker", () => {
    const check = lightingCheck({ mainsHz: 50, flicker: 300, modulationPercent: 100 }, [
      { name: 'spindle', speedHz: 50, symmetry: 6 },
    ]);
    const text = check.remedies.map((r) => remedyWords(r, check)).join(' ');
    expect(text).toMatch(/dimmer's switching frequency/);
    expect(text).not.toMatch(/three-phase/);
  });
});
