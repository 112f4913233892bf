// What the check screen shows under its answer, in a chunk of its own (lazy-results.ts): the
// rates to try, the bands that show the true way, the camera and lighting read-outs, keeping
// and sharing the machine, and the report. None of it is needed for the first paint. The lists
// follow the set-up a paint behind the answer (src/state/check/listed.ts); keeping, sharing and
// the report work on the set-up on screen.
import { computed } from '@preact/signals';
import type { CautionContext } from '../../core';
import { check } from '../../state/check';
import { computeCheck, listedCheck, listsProblem } from '../../state/check/lists';
import { activeIndex, partLabel } from '../../state/model';
import { flashUnit, setup } from '../../state/setup';
import { LightingReadout } from '../../ui/lighting-readout';
import { ReportBar } from '../../ui/report-bar';
import { CameraReadout } from './camera-readout';
import { checkCsv } from './csv';
import { KeepShare } from './keep-share';
import { RateSuggestions } from './rate-suggestions';
import { ResultsGuard } from './results-guard';
import { screenShowsFlashing, screenShowsSafety, verdictWithdrawn } from './screen-flags';
import { SafeBands } from './safe-bands';

/** Works out the lists before they are first drawn (lazy-results.ts), in a task of its own. */
export function workOutLists(): void {
  void listedCheck.value;
}

/** The lists under the answer, each marked not current while an entry is refused. */
export function CheckLists() {
  return (
    <>
      <RateSuggestions />
      <ResultsGuard refusal={listsProblem.value}>
        <SafeBands />
        <CameraReadout />
        <LightingReadout />
      </ResultsGuard>
    </>
  );
}

/** Keeping and sharing the machine: it works on the set-up on screen, never a paint behind. */
export { KeepShare };

/** The flash rate that needs the photosensitivity caution now, if any. */
const flashingNow = computed(() => (screenShowsFlashing.value ? check.value.rateHz : null));
/**
 * The cautions the report carries, as the screen shows them. A signal: a keystroke that flips one
 * re-renders the printed cautions, not the report bar.
 */
const reportCautions = computed<CautionContext>(() => {
  const flashing = flashingNow.value;
  return {
    apparentStillness: screenShowsSafety.value,
    flashRatesHz: flashing === null ? [] : [flashing],
  };
});

/**
 * Print and CSV of the check, with the cautions the verdict carries; no CSV while it is
 * withdrawn. Both are of the set-up on screen, never of the lists a paint behind it.
 */
export function CheckReport() {
  return (
    <ReportBar
      title="Check"
      cautions={reportCautions}
      csv={verdictWithdrawn.value ? undefined : checkTable}
    />
  );
}

/** The check as CSV, worked out from the set-up on screen (the core's refusal is said by the bar). */
function checkTable(): string {
  const s = setup.peek();
  const r = computeCheck(s);
  return checkCsv(r, partLabel(s, activeIndex(s)), r.samplerKind, flashUnit.peek());
}
