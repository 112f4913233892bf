import { useEffect } from 'preact/hooks';
import {
  analyseFile,
  analyseKept,
  cancelListening,
  listen,
  LISTEN_S,
  listenStatus,
  soundCapture,
  stopListening,
} from '../../../state/soundSpeed';
import { formatNumber } from '../../../words/format';
import { captureProblemWords } from '../../../words/sound';
import { ProgressRing } from './progress-ring';
import style from './style.module.css';

/** Only read before the capture is set, which the panel's loading prevents. */
const NO_LIMITS = { maxFileBytes: 0, maxRecordingS: 0 };

/**
 * Listen (a few seconds, with a progress ring and a way to stop early) or pick a recording; the
 * sound is analysed at once and only its spectrum is kept (state/soundSpeed.ts, which holds
 * where this stands). Problems get a sentence of their own; microphone problems point to the
 * file route beside the button.
 */
export function ListenControls() {
  const status = listenStatus.value;
  const capture = soundCapture.value;

  // Leaving the screen while listening drops the recording and releases the microphone.
  useEffect(() => cancelListening, []);

  const pick = (input: HTMLInputElement) => {
    const file = input.files?.[0];
    // The same file may be picked again later: the input forgets it.
    input.value = '';
    if (file && capture) void analyseFile(capture, file);
  };

  const busy = !capture || status.kind === 'listening' || status.kind === 'analysing';
  return (
    <div class={style.controls}>
      {status.kind === 'listening' ? (
        <div class={style.listening} data-testid="listening">
          <ProgressRing doneS={status.recordedS} totalS={status.totalS} />
          <div class={style.listeningWords}>
            <p>Listening… hold the phone still, pointed at the part.</p>
            <button type="button" class={style.quietButton} onClick={stopListening}>
              Stop now and use what was heard
            </button>
          </div>
        </div>
      ) : (
        <button
          type="button"
          class={style.listen}
          disabled={busy}
          onClick={() => capture && listen(capture)}
        >
          Listen ({formatNumber(LISTEN_S)} s)
        </button>
      )}
      <label class={style.fileButton} data-busy={busy || undefined}>
        <input
          type="file"
          accept="audio/*"
          class={style.fileInput}
          disabled={busy}
          onChange={(e) => pick(e.currentTarget as HTMLInputElement)}
        />
        Analyse a recording
      </label>
      {status.kind === 'analysing' && (
        <p class={style.quiet} role="status" data-testid="analysing">
          {status.from.source === 'file'
            ? `Reading “${status.from.fileName ?? 'the file'}”…`
            : 'Reading what was heard…'}
        </p>
      )}
      {status.kind === 'problem' && (
        <div class={style.problem} role="alert" data-testid="sound-problem" data-code={status.code}>
          <p>
            {status.code === 'unreadable'
              ? status.message
              : captureProblemWords(status.code, capture?.limits ?? NO_LIMITS)}
          </p>
          {status.kept && (
            <button type="button" class={style.quietButton} onClick={analyseKept}>
              Analyse it anyway
            </button>
          )}
        </div>
      )}
    </div>
  );
}
