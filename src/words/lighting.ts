// The lighting check in words: each part under the light, the summary, the headline, the risk
// class and the remedies, from the codes and numbers of the core's lightingCheck.
import {
  hzToRpm,
  plainNumber,
  type FlickerRisk,
  type LightingCheck,
  type LightingRemedy,
  type PartUnderLight,
} from '../core';
import { canLookWords } from './look';

/** The answer at the top of the lighting screen, per verdict. */
export const LIGHTING_HEADLINES: Record<LightingCheck['verdict'], string> = {
  hazard: 'Hazard: a part can look still or backward',
  caution: 'Caution: a misleading look is possible',
  fine: 'No part looks still or backward',
};

/** A part's verdict in the table. */
export const PART_VERDICT_WORDS: Record<PartUnderLight['verdict'], string> = {
  hazard: 'HAZARD',
  caution: 'Caution',
  fine: 'Fine',
};

/** The deferral every lighting result carries: said once, as the last remedy or on its own. */
export const LOCAL_RULES_NOTE =
  'Local lighting rules and machinery-safety rules come first: this check is a planning aid, not an assessment.';

/** The flicker's class by IEEE Std 1789-2015 inside a sentence. */
export function riskWords(risk: FlickerRisk): string {
  return risk === 'no-effect'
    ? 'no observable effect'
    : risk === 'low-risk'
      ? 'low risk'
      : 'above the low-risk line';
}

/** The flicker's class by IEEE Std 1789-2015 on its own line, against the standard's two lines. */
export const RISK_LINE_WORDS: Record<FlickerRisk, string> = {
  'no-effect': 'Below the no-observable-effect line',
  'low-risk': 'Between the no-effect and low-risk lines',
  elevated: 'Above the low-risk line',
};

const rpm = (speedHz: number) => `${plainNumber(Math.abs(hzToRpm(speedHz)))} rpm`;

/**
 * One part under the light, in a sentence or two.
 * @example partWords(check.parts[0], check) // "chuck can look still under this light although it turns at 3000 rpm. Hazard: …"
 */
export function partWords(part: PartUnderLight, check: LightingCheck): string {
  const { name } = part;
  const trueSpeed = rpm(part.speedHz);
  if (check.modulationPercent === 0) {
    return `${name}: the light does not flicker, so it looks as it is (${trueSpeed}).`;
  }
  const svm = plainNumber(check.svm);
  const how = canLookWords(part.worstLook, part.images);
  if (part.verdict === 'hazard') {
    return `${name} can ${how} under this light although it turns at ${trueSpeed}. Hazard: the flicker is visible (SVM ${svm}).`;
  }
  if (part.verdict === 'caution') {
    return (
      `${name} can ${how} under this light although it turns at ${trueSpeed}. The flicker is below the ` +
      `average observer's threshold (SVM ${svm} < 1), but some people may still see it.`
    );
  }
  const seen =
    part.look === 'true'
      ? 'turns the right way at its true speed'
      : `turns the right way, though it seems slower (${plainNumber(Math.abs(part.apparentRpm))} rpm)`;
  return `${name} ${seen}${check.visible ? '; the flickering motion is visible' : ''}.`;
}

/** The whole result in a few sentences: the light, then what it does to the parts. */
export function lightingSummary(check: LightingCheck): string {
  const light =
    check.modulationPercent === 0
      ? 'The light does not flicker.'
      : `The light flickers at ${plainNumber(check.flickerHz)} Hz with ${plainNumber(check.modulationPercent)} % modulation: ` +
        `${riskWords(check.risk)} by IEEE Std 1789-2015, SVM ${plainNumber(check.svm)}.`;
  if (check.verdict === 'hazard') {
    const names = check.parts.filter((r) => r.hazard).map((r) => r.name);
    return `${light} Hazard: ${names.join(', ')} can look still or backward while turning.`;
  }
  if (check.verdict === 'caution') {
    const names = check.parts.filter((r) => r.verdict === 'caution').map((r) => r.name);
    return names.length > 0
      ? `${light} Caution: ${names.join(', ')} can look misleading to some people.`
      : `${light} Caution: the flicker itself is above the IEEE 1789 low-risk line.`;
  }
  return `${light} No part looks still or backward under it.`;
}

/** What to do, in words, with the figures of this light. */
export function remedyWords(remedy: LightingRemedy, check: LightingCheck): string {
  switch (remedy) {
    case 'steady-drivers':
      return (
        `Use lamps whose drivers do not flicker at this rate: electronic drivers that run the lamp at high frequency, ` +
        `or low-flicker LED drivers (at ${plainNumber(check.flickerHz)} Hz the IEEE 1789 no-observable-effect line is ` +
        `${plainNumber(check.noEffectPercent)} %).`
      );
    case 'split-phases':
      return (
        'Where several lamps light the machine, connect neighbouring lamps to different phases of a three-phase ' +
        'supply: their flicker peaks fall at different moments and largely cancel.'
      );
    case 'faster-dimmer':
      return "Raise the dimmer's switching frequency, or run the lamps undimmed where the dimmer then stops switching.";
    case 'task-lamp':
      return 'Light the working area of the machine with a task lamp on a steady source, so the flickering light no longer dominates.';
    case 'local-rules':
      return LOCAL_RULES_NOTE;
  }
}
