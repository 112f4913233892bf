// The speed finder in words: the stage headings, the next instruction, and why each candidate
// stands where it does, from the codes and numbers of the core's speedFinderSteps.
import { saveWords } from './saving';
import {
  hzToFpm,
  hzToRpm,
  plainNumber,
  type SpeedFinderStage,
  type SpeedFinderStep,
  type StepCandidate,
  type StepGuide,
} from '../core';
import type { SavedSpeed, SpeedChange } from '../state/speedFinder';
import { formatNumber } from './format';
import { viewWords } from './look';
import { heardOriginWords } from './sound';

/** The heading over the instruction, per stage of the procedure. */
export const STAGE_TITLES: Record<SpeedFinderStage, string> = {
  start: 'Start high',
  'come-down': 'Keep coming down',
  confirm: 'Confirm at the double image',
  separate: 'Tell the speeds apart',
  done: 'Speed found',
  conflict: 'The readings disagree',
};

/** What the table says about a candidate's place: likeliest, in the expected range, ruled out. */
export function candidateStatus(c: StepCandidate): string {
  if (c.likeliest) return c.expected ? 'Likeliest (in the expected range)' : 'Likeliest';
  if (c.ruledOut) return 'Ruled out';
  return c.expected ? 'Fits, in the expected range' : 'Fits';
}

/**
 * The table's caption, in step with its rows: how many speeds are still in the running, and how
 * many fit the readings but the sweep rules out.
 * @example candidateCaption([]) // '0 speeds fit every reading; likeliest first'
 */
export function candidateCaption(candidates: readonly StepCandidate[]): string {
  const ruledOut = candidates.filter((c) => c.ruledOut).length;
  const left = candidates.length - ruledOut;
  const speeds = (n: number) => `${n} ${n === 1 ? 'speed' : 'speeds'}`;
  if (ruledOut === 0) {
    return `${speeds(left)} ${left === 1 ? 'fits' : 'fit'} every reading; likeliest first`;
  }
  return (
    `${speeds(left)} ${left === 1 ? 'fits' : 'fit'} the readings and the sweep; ` +
    `${ruledOut} more ${ruledOut === 1 ? 'fits' : 'fit'} the readings but ${ruledOut === 1 ? 'is' : 'are'} ruled out; likeliest first`
  );
}

const fpm = (hz: number) => `${plainNumber(hzToFpm(hz))} flashes/min`;
const rpm = (hz: number) => `${plainNumber(hzToRpm(hz))} rpm`;

/** Why a candidate stands where it does in the table. */
export function candidateNote(c: StepCandidate): string {
  if (c.ruledOut) {
    return `Would have stood still as a single image at ${fpm(c.firstSingleHz)} on the way down.`;
  }
  return c.expected ? 'Fits every reading and the expected range.' : 'Fits every reading.';
}

/**
 * The next instruction in plain words, from the step's guide and rate.
 * @example stepInstruction(speedFinderSteps({ readings: [], symmetry: 1, strobeRange })) // "Set the strobe to 12000 flashes/min (the top of the strobe's range) and lower …"
 */
export function stepInstruction(step: SpeedFinderStep): string {
  const g = step.guide;
  switch (g.stage) {
    case 'start':
      return startWords(g, step.rateHz ?? step.sweptFromHz);
    case 'conflict':
      return (
        'These readings fit no single speed. Check each rate and image count (a mark that is not ' +
        'the only one of its kind, or two images read as one, are the usual causes) and remove the doubtful reading.'
      );
    case 'come-down':
      return g.belowStrobe
        ? `Keep lowering the rate from ${fpm(g.fromHz)}. If the part turns at ${rpm(g.leadHz)}, the first ` +
            `single image would be at ${fpm(g.nextSingleHz)}, below the strobe's lowest rate: record any single image you find.`
        : `Keep lowering the rate from ${fpm(g.fromHz)} until a single image stands still. If the part turns at ` +
            `${rpm(g.leadHz)}, that happens at ${fpm(g.nextSingleHz)}.`;
    case 'confirm':
      return confirmWords(g, step.rateHz ?? 0);
    case 'separate':
      return separateWords(g, step.rateHz ?? 0);
    case 'done':
      return doneWords(g);
  }
}

function startWords(g: Extract<StepGuide, { stage: 'start' }>, startHz: number): string {
  const where =
    g.from === 'strobe-top' ? "the top of the strobe's range" : 'just above the expected speed';
  const mark = g.symmetry === 1 ? 'the mark' : 'the part';
  let text =
    `Set the strobe to ${fpm(startHz)} (${where}) and lower the rate slowly. Several images may stand ` +
    `still on the way down; go on until ${mark} stands still as a single image for the first time, then ` +
    'record that rate with 1 image.';
  if (g.expectedAboveStrobe) {
    text +=
      " The expected speed is above the strobe's top rate, so the first single image will be at a " +
      'fraction of the true speed; the steps that follow sort that out.';
  }
  if (g.symmetry > 1)
    text += ' A single reflective mark on the part makes the reading unambiguous.';
  return text;
}

function confirmWords(g: Extract<StepGuide, { stage: 'confirm' }>, confirmHz: number): string {
  const leadRate = fpm(g.symmetry * g.leadHz);
  const how = {
    'twice-reading': `twice the single-image rate ${fpm(g.firstSingleHz)}`,
    'two-thirds-reading': `two thirds of the single-image rate ${fpm(g.firstSingleHz)}`,
    'twice-lead': `twice ${leadRate}, the single-image rate of ${rpm(g.leadHz)}`,
    'two-thirds-lead': `two thirds of ${leadRate}, the single-image rate of ${rpm(g.leadHz)}`,
  }[g.basis];
  const look =
    g.symmetry === 1
      ? 'two marks half a turn apart'
      : `${2 * g.symmetry} features, evenly spaced (twice the ${g.symmetry} the part has)`;
  return (
    `Now set ${fpm(confirmHz)} (${how}). If the part turns at ` +
    `${rpm(g.leadHz)}, ${look} stand still there. Record what you see; a single image there means the ` +
    'part turns faster and the search goes on.'
  );
}

function separateWords(g: Extract<StepGuide, { stage: 'separate' }>, rateHz: number): string {
  const views = g.compared.map((c) => `at ${rpm(c.speedHz)}: ${viewWords(c.view)}`).join('; ');
  const which =
    g.rivals > g.compared.length
      ? `the ${g.compared.length} likeliest of the ${g.rivals} speeds that still fit`
      : `the ${g.rivals} speeds that still fit`;
  let text = `Set ${fpm(rateHz)} and compare what you see with ${which} (${views}).`;
  text += g.standing
    ? ' Where images stand still or drift slowly, small changes of rate stop them: record that rate and how many images.'
    : ' Nothing is expected to stand still there: the way the part seems to move tells the speeds apart.';
  if (!g.separatesTop) {
    text +=
      " No rate in the strobe's range shows the likeliest speed differently from every other; this one tells the most of them apart.";
  }
  return text;
}

function doneWords(g: Extract<StepGuide, { stage: 'done' }>): string {
  let text = `The part turns at ${rpm(g.speedHz)} (single image at ${fpm(g.firstSingleHz)}`;
  text +=
    g.check === 'passed'
      ? ', confirmed by the two images).'
      : g.check === 'no-room'
        ? "; the two-image check does not fit in the strobe's range)."
        : `; the check at ${fpm(g.confirmHz ?? 0)} did not show two images, and this is the speed that fits every reading).`;
  if (g.othersAlike > 0) {
    text += ` ${g.othersAlike} other ${g.othersAlike === 1 ? 'speed' : 'speeds'} in the table fit the readings too and no rate in the strobe's range tells them apart; the one given is the slowest.`;
  } else if (g.othersOutside > 0) {
    text += ` ${g.othersOutside} ${g.othersOutside === 1 ? 'speed' : 'speeds'} outside the expected range fit the readings too (see the table).`;
  }
  if (g.outsideExpected) {
    text +=
      ' It lies outside the expected range: check the nameplate and the mark, and whether the first ' +
      'single image was missed on the way down.';
  }
  text += ' You can save this speed to the machine.';
  if (g.symmetry > 1) {
    text += ` (${g.symmetry} features: the speed is the single-image rate divided by ${g.symmetry}.)`;
  }
  return text;
}

const rpmText = (rpm: number) => `${formatNumber(rpm)} rpm`;

/** One change the speed found made to the set-up, in a sentence. */
export function speedChangeWords(c: SpeedChange): string {
  switch (c.kind) {
    case 'speed':
      return `${c.part}: speed ${rpmText(c.fromRpm)} → ${rpmText(c.toRpm)}.`;
    case 'leaves-motor':
      return `${c.part} no longer takes its speed from the motor nameplate.`;
    case 'leaves-wheel':
      return `${c.part} no longer takes its speed from the ground speed and tyre size.`;
    case 'leaves-drive':
      return `${c.part} is no longer worked out from the drive from ${c.driver}.`;
    case 'features':
      return `${c.part}: features ${c.from} → ${c.to}.`;
    case 'tolerance':
      return `${c.part}: tolerance ±${formatNumber(c.fromPercent)} % → ±${formatNumber(c.toPercent)} %.`;
    case 'driven-speed':
      return `${c.part}, driven from it: speed ${rpmText(c.fromRpm)} → ${rpmText(c.toRpm)}.`;
  }
}

/**
 * What saving the speed did, a sentence a line: each change, where the speed came from, then
 * where it went — "Saved" only when the machine reached the device (saving.ts says what
 * happened otherwise).
 */
export function savedSpeedLines(saved: SavedSpeed): string[] {
  const where =
    saved.machineName === null
      ? 'Changed in the set-up on the Check screen only (no machine saved).'
      : saved.saved
        ? saveWords(saved.machineName, saved.saved.outcome, `Saved to "${saved.machineName}".`).text
        : `Saved to "${saved.machineName}".`;
  const origin = saved.origin
    ? [`Speed found ${heardOriginWords(saved.origin, saved.origin.tolerancePercent)}.`]
    : [];
  return [...saved.changes.map(speedChangeWords), ...origin, where];
}
