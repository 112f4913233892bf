// What the check screen shows under its answer, in a chunk of its own (lazy-results.ts): the
// rates to try, the bands that show the true way, the camera and lighting read-outs, keeping
// and sharing the machine, and the report. None of it is needed for the first paint, and all
// of it follows the set-up a paint behind the answer (src/state/check/listed.ts).
import { checkProblem, listedAnswer, listedSetup } from '../../state/check';
import { listedCheck } from '../../state/check/lists';
import { problemsAmong } from '../../state/fieldProblems';
import { activeIndex, partLabel } from '../../state/model';
import { flashUnit } from '../../state/setup';
import { LightingReadout } from '../../ui/lighting-readout';
import { ReportBar } from '../../ui/report-bar';
import { CameraReadout } from './camera-readout';
import { checkCsv } from './csv';
import { VERDICT_FIELDS } from './field-ids';
import { KeepShare } from './keep-share';
import { RateSuggestions } from './rate-suggestions';
import { ResultsGuard } from './results-guard';
import { SafeBands } from './safe-bands';

/** The lists under the answer, each marked not current while an entry is refused. */
export function CheckLists() {
  return (
    <>
      <RateSuggestions />
      <ResultsGuard>
        <SafeBands />
        <CameraReadout />
        <LightingReadout />
      </ResultsGuard>
    </>
  );
}

/** Keeping and sharing the machine: it works on the set-up on screen, never a paint behind. */
export { KeepShare };

/** Print and CSV of the check, with the cautions the verdict carries; no CSV while it is withdrawn. */
export function CheckReport() {
  const refusal = checkProblem.value;
  const r = listedAnswer.value;
  const withdrawn = problemsAmong(VERDICT_FIELDS).length > 0 || refusal !== undefined;
  return (
    <ReportBar
      title="Check"
      cautions={{
        apparentStillness: r.showSafety || withdrawn,
        flashRatesHz: r.showPhotosensitivity ? [r.rateHz] : [],
      }}
      csv={
        withdrawn
          ? undefined
          : () => {
              const s = listedSetup.peek();
              const shown = listedCheck.peek();
              return checkCsv(
                shown,
                partLabel(s, activeIndex(s)),
                shown.samplerKind,
                flashUnit.peek(),
              );
            }
      }
    />
  );
}
