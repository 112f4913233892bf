import { useState } from 'preact/hooks';
import type { SoundSpeedCandidate } from '../../../core';
import { openMachineName } from '../../../state/session';
import { applyHeardSpeed, forgetSound, heardSound, soundSpeeds } from '../../../state/soundSpeed';
import {
  featuresInUse,
  finderPartKind,
  type SaveTarget,
  type HeardOrigin,
} from '../../../state/speedFinder';
import { ResultTable, type ResultColumn } from '../../../ui/result-table';
import { spectrumMarks } from '../../../ui/spectrum-chart/chart-data';
import { SpectrumChart } from '../../../ui/spectrum-chart';
import {
  CLIPPED_WORDS,
  CONFIDENCE_WORDS,
  heardAsWords,
  heardFromWords,
  noToneWords,
  speedFigures,
  TONE_NAMES,
} from '../../../words/sound';
import { savedSpeedLines } from '../../../words/speedFinder';
import style from './style.module.css';

type Outcome = { kind: 'done' | 'problem'; lines: string[]; speedHz: number } | null;

/**
 * What was heard: where from, the spectrum with the tone, its comb and the hum marked, and every
 * speed that explains it, each with its precision, how sure it is, and one tap to apply it to
 * the part (through applyHeardSpeed, the one way a speed heard reaches the part).
 */
export function SoundResult() {
  const heard = heardSound.value;
  const speeds = soundSpeeds.result.value;
  const refusal = soundSpeeds.problem.value;
  const kind = finderPartKind.value;
  const n = featuresInUse.value;
  const machineName = openMachineName.value;
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [busy, setBusy] = useState(false);
  if (!heard) return null;

  const apply = async (c: SoundSpeedCandidate, target: SaveTarget) => {
    const origin: HeardOrigin = {
      method: 'sound',
      precisionHz: c.precisionHz,
      heardAtMs: heard.heardAtMs,
    };
    setBusy(true);
    try {
      const saved = await applyHeardSpeed(c.speedHz, origin, target);
      setOutcome({ kind: 'done', lines: savedSpeedLines(saved), speedHz: c.speedHz });
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      setOutcome({ kind: 'problem', lines: [message], speedHz: c.speedHz });
    } finally {
      setBusy(false);
    }
  };

  const candidates = speeds?.candidates ?? [];
  const leader = candidates[0];
  const tied =
    leader?.confidence === 'tied' ? candidates.filter((c) => c.confidence === 'tied') : [];
  const band = { minHz: heard.spectrum.minToneHz, maxHz: heard.spectrum.maxToneHz };
  const columns: ReadonlyArray<ResultColumn<SoundSpeedCandidate>> = [
    {
      label: 'Speed',
      numeric: true,
      cell: (c) => {
        const f = speedFigures(c);
        return (
          <span class={style.speedCell}>
            <strong>{f.rpm} rpm</strong>
            <span>± {f.plusMinus} rpm</span>
            <span>(±{f.percent} %)</span>
          </span>
        );
      },
    },
    {
      label: 'How sure',
      cell: (c) => (
        <span class={style.sure} data-confidence={c.confidence}>
          {CONFIDENCE_WORDS[c.confidence].label}
        </span>
      ),
    },
    { label: 'Heard as', cell: (c) => heardAsWords(c, kind) },
    {
      label: 'Apply',
      action: true,
      cell: (c) => (
        <button
          type="button"
          class={style.applyButton}
          disabled={busy}
          onClick={() => void apply(c, { kind: 'setup' })}
        >
          Use {speedFigures(c).rpm} rpm
        </button>
      ),
    },
  ];

  return (
    <div class={style.result} data-testid="sound-result">
      <p class={style.quiet}>
        Heard: {heardFromWords(heard)}.{' '}
        <button type="button" class={style.link} onClick={forgetSound}>
          Forget it
        </button>
      </p>
      {refusal && (
        <p class={style.problem} role="alert">
          {refusal}
        </p>
      )}
      {speeds?.clipped && <p class={style.note}>{CLIPPED_WORDS}</p>}
      {speeds?.noTone && (
        <p class={style.problem} role="alert" data-testid="no-tone" data-reason={speeds.noTone}>
          {noToneWords(speeds.noTone, speeds.searchedHz)}
        </p>
      )}
      {leader && (
        <div
          class={style.headline}
          data-testid="sound-leader"
          data-rpm={(leader.speedHz * 60).toFixed(2)}
          data-confidence={leader.confidence}
        >
          {tied.length > 1 ? (
            // Never one big number where the sound cannot choose: every tied speed, alike.
            <p class={style.big}>{tied.map((c) => `${speedFigures(c).rpm} rpm`).join(' or ')}</p>
          ) : (
            <p class={style.big}>
              {speedFigures(leader).rpm} rpm{' '}
              <span class={style.plusMinus}>
                ± {speedFigures(leader).plusMinus} rpm (±{speedFigures(leader).percent} %)
              </span>
            </p>
          )}
          <p>
            <strong>{CONFIDENCE_WORDS[leader.confidence].label}:</strong>{' '}
            {CONFIDENCE_WORDS[leader.confidence].meaning}
          </p>
        </div>
      )}
      {speeds && (
        <SpectrumChart
          spectrum={heard.spectrum}
          marks={spectrumMarks(leader, n, speeds.hum, band, heard.spectrum.binHz)}
          toneName={TONE_NAMES[kind]}
        />
      )}
      {candidates.length > 0 && (
        <div class={style.tableBox}>
          <ResultTable
            caption={`${candidates.length === 1 ? 'The speed' : `${candidates.length} speeds`} that explain the sound, best first`}
            columns={columns}
            rows={candidates}
            rowKey={(c) => String(c.speedHz)}
            rowState={(c) => (c === leader && c.confidence === 'clear' ? 'pass' : undefined)}
            testId="sound-candidates"
          />
        </div>
      )}
      {outcome && (
        <div class={style.outcome} data-kind={outcome.kind} data-testid="sound-applied">
          <ul class={style.outcomeList} role={outcome.kind === 'problem' ? 'alert' : 'status'}>
            {outcome.lines.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
          {outcome.kind === 'done' && machineName && (
            <button
              type="button"
              class={style.quietButton}
              disabled={busy}
              onClick={() => {
                const c = candidates.find((x) => x.speedHz === outcome.speedHz);
                if (c) void apply(c, { kind: 'open' });
              }}
            >
              Save it to “{machineName}” too
            </button>
          )}
        </div>
      )}
    </div>
  );
}
