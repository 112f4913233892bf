// The speed finder's step when a speed was heard (docs/physics.md §11.7): the sound joined with
// the strobe readings (the core's joinSoundWithStrobe) as a heading and an instruction.
import {
  hzToFpm,
  plainNumber,
  type SoundSpeedCandidate,
  type SoundStrobeJoin,
  type SoundStrobeMatch,
  type StrobeView,
} from '../core';
import { formatNumber } from './format';
import { CONFIDENCE_WORDS, soundSpeedWords } from './sound';

/** Where the two methods stand: one strobe reading to confirm, speeds to tell apart, found, or at odds. */
export type SoundStage = 'sound-confirm' | 'sound-separate' | 'sound-agrees' | 'sound-disagrees';

export const SOUND_STAGE_TITLES: Readonly<Record<SoundStage, string>> = {
  'sound-confirm': 'Heard: confirm with one strobe reading',
  'sound-separate': 'Tell the speeds apart',
  'sound-agrees': 'Speed found: sound and strobe agree',
  'sound-disagrees': 'The sound and the readings disagree',
};

/** The stage a join stands at (undefined: the sound gave no speed, the strobe steps stand alone). */
export function soundStageOf(join: SoundStrobeJoin): SoundStage | undefined {
  switch (join.status) {
    case 'sound-only':
      return join.speedHz === undefined ? 'sound-separate' : 'sound-confirm';
    case 'one':
      return 'sound-agrees';
    case 'several':
      return 'sound-separate';
    case 'disagree':
      return 'sound-disagrees';
    case 'no-sound':
      return undefined;
  }
}

const fpm = (hz: number) => `${plainNumber(hzToFpm(hz))} flashes/min`;
const rpm = (hz: number) => `${formatNumber(hz * 60)} rpm`;

/**
 * What a speed shows under a flash at the rate to try, inside a sentence.
 * @example strobeViewWords({ speedHz: 29.17, images: 2, look: 'still' }) // "2 images stand still"
 */
export function strobeViewWords(v: Pick<StrobeView, 'images' | 'look'>): string {
  switch (v.look) {
    case 'still':
      return v.images === 1 ? 'a single image stands still' : `${v.images} images stand still`;
    case 'true':
      return 'it moves at its true speed';
    case 'unclear':
      return 'it flickers with no clear direction';
    case 'backward':
      return v.images > 1 ? `${v.images} images turn backward` : 'it seems to turn backward';
    case 'forward':
      return v.images > 1 ? `${v.images} images creep forward` : 'it seems to creep forward';
  }
}

/** "at 1,750 rpm a single image stands still; at 875 rpm 2 images stand still". */
function viewsWords(views: readonly StrobeView[]): string {
  return views.map((v) => `at ${rpm(v.speedHz)} ${strobeViewWords(v)}`).join('; ');
}

/** "1,750 rpm or 875 rpm", "1,750, 875 or 583.3 rpm". */
function speedsList(speedsHz: readonly number[]): string {
  const all = speedsHz.map((s) => formatNumber(s * 60));
  if (all.length === 1) return `${all[0]} rpm`;
  return `${all.slice(0, -1).join(', ')} or ${all.at(-1)} rpm`;
}

/**
 * The next instruction when a speed was heard: confirm it with one reading, tell the speeds
 * apart, apply it, or sort out a disagreement. `leader` is the sound's best speed.
 */
export function soundStepInstruction(
  join: SoundStrobeJoin,
  leader: SoundSpeedCandidate,
  readingCount: number,
): string {
  const rate = join.nextRateHz;
  const views = join.views ?? [];
  const readingsWord = readingCount === 1 ? 'the strobe reading' : 'the strobe readings';
  switch (soundStageOf(join)) {
    case 'sound-confirm': {
      const heard = `By sound the part turns at ${soundSpeedWords(leader)} (${CONFIDENCE_WORDS[leader.confidence].label.toLowerCase()}).`;
      if (rate === undefined || views.length === 0) {
        return `${heard} No rate in the strobe's range shows it standing still: apply it, or widen the strobe's range to confirm it.`;
      }
      return (
        `${heard} Set ${fpm(rate)}: at that speed ${strobeViewWords(views[0])}. ` +
        'Record what you see as a reading: if it matches, the strobe confirms the speed.'
      );
    }
    case 'sound-separate': {
      const open =
        join.status === 'several'
          ? `The sound and ${readingsWord} both allow ${speedsList(join.matches.map((m) => m.speedHz))}.`
          : `The sound fits ${speedsList(views.map((v) => v.speedHz))} about equally.`;
      if (rate === undefined) return `${open} No rate in the strobe's range tells them apart.`;
      return `${open} Set ${fpm(rate)}: ${viewsWords(views)}. Record what you see.`;
    }
    case 'sound-agrees':
      return (
        `The part turns at ${soundSpeedWords({ speedHz: join.speedHz!, precisionHz: join.precisionHz! })}: ` +
        `the sound and ${readingsWord} agree, and no other speed fits both. You can save it to the machine below.`
      );
    case 'sound-disagrees': {
      const text =
        `No speed heard fits ${readingsWord}. Check the count of features and each reading, or ` +
        'listen again nearer the part.';
      return rate === undefined || views.length === 0
        ? text
        : `${text} At ${fpm(rate)}, ${rpm(leader.speedHz)} (heard) would show: ${strobeViewWords(views[0])}.`;
    }
    default:
      return '';
  }
}

/** A strobe candidate's standing once the sound is joined in. */
export function heardStatus(row: { lead: boolean; heard?: unknown }): string {
  if (row.lead) return 'Likeliest: heard and seen';
  return row.heard ? 'Fits, and heard' : 'Fits the readings, not heard';
}

/**
 * Why a strobe candidate stands where it does once the sound is joined in.
 * @example heardNote({ heard: { speedHz: 29.1667, precisionHz: 0.01, soundConfidence: 'clear' } }) // "Heard at 1,750 rpm ± 0.6 rpm (clear)."
 */
export function heardNote(row: {
  heard?: Pick<SoundStrobeMatch, 'speedHz' | 'precisionHz' | 'soundConfidence'>;
}): string {
  if (!row.heard) return 'Fits every reading, but no line of the sound fits it.';
  const sure = CONFIDENCE_WORDS[row.heard.soundConfidence].label.toLowerCase();
  return `Heard at ${soundSpeedWords(row.heard)} (${sure}).`;
}
