// Why no setting of the camera reaches the goal, in plain words, from the core's numbers.
import type { CameraGoal, CameraAbilities, Part } from '../../core';
import { formatExposure, formatNumber, formatPrecise } from '../../lib/format';
import { attempt } from '../../state/outcome';
import { whyNoneReach } from '../../state/cameraPlanning';

function rateList(ratesHz: number[]): string {
  return ratesHz.map((r) => `${formatPrecise(r)} fps`).join(', ');
}

/**
 * A sentence saying what the goal needs and that the camera does not offer it.
 * @example noneReachText({ speedHz: 29.5, symmetry: 6, tolerance: 0.01 }, { kind: 'freeze' }, camera)
 * // "To freeze it, a frame rate must go into the pattern's 177 passes a second a whole number of times: 177 fps, 88.5 fps, 59 fps, 44.25 fps. None of the camera's rates is one of them."
 */
export function noneReachText(
  part: Required<Part>,
  goal: CameraGoal,
  camera: CameraAbilities,
): string {
  const found = attempt(() => whyNoneReach(part, goal));
  if (!found.ok) return found.message;
  const w = found.result;
  const patternHz = part.symmetry * Math.abs(part.speedHz);
  if (patternHz === 0) return 'The part is not turning: there is nothing to plan for.';
  const longest = Math.max(
    ...(camera.exposuresS ?? []),
    ...(camera.shutterAnglesDeg ?? []).flatMap((a) => camera.frameRatesHz.map((s) => a / 360 / s)),
  );
  const disc = `an exposure of ${formatExposure(w.minExposureS)} or longer, so the features smear into an even disc`;
  switch (w.kind) {
    case 'freeze':
      return w.ratesHz.length > 0
        ? `To freeze it, a frame rate must go into the pattern's ${formatNumber(patternHz)} passes a second a whole number of times: ${rateList(w.ratesHz)}. None of the camera's rates is one of them, with a short enough exposure.`
        : `To freeze it, a frame rate must go into the pattern's ${formatNumber(patternHz)} passes a second a whole number of times; no such rate lies between 1 and 1,000 fps.`;
    case 'creep':
      return w.ratesHz.length > 0
        ? `That slow forward turn needs a frame rate near ${rateList(w.ratesHz)}, with a short exposure. The camera offers none of them.`
        : 'No frame rate between 1 and 1,000 fps shows that slow forward turn.';
    case 'natural':
      return `A natural, smoothly blurred disc needs ${disc}. The longest exposure on offer is ${formatExposure(longest)}.`;
    case 'honest':
      return `Nothing misleading needs a frame rate above ${formatPrecise(w.faithfulAboveHz)} fps, or ${disc}. The camera offers neither (longest exposure ${formatExposure(longest)}).`;
  }
}
