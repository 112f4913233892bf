import { useEffect, useRef, useState } from 'preact/hooks';
import {
  MAX_SOUND_FILE_BYTES,
  SoundCaptureError,
  type ListeningSession,
  type SoundCaptureProblem,
  type SoundRecording,
} from '../../../audio';
import { MAX_RECORDING_S, soundSpectrum } from '../../../core';
import { attempt } from '../../../state/outcome';
import { heardSound } from '../../../state/soundSpeed';
import { formatNumber } from '../../../words/format';
import { captureProblemWords } from '../../../words/sound';
import type { SoundCapture } from './capture';
import { ProgressRing } from './progress-ring';
import style from './style.module.css';

interface Props {
  capture: SoundCapture;
}

/** Seconds recorded when nobody stops early: enough for a spectrum to 0.05 % (docs/physics.md §11.4). */
export const LISTEN_S = 4;

type Status =
  | { kind: 'idle' }
  | { kind: 'listening'; recordedS: number; totalS: number }
  | { kind: 'reading'; fileName: string }
  | {
      kind: 'problem';
      code: SoundCaptureProblem;
      /** A clipped recording, kept to analyse anyway. */
      kept?: { recording: SoundRecording; source: 'microphone' | 'file'; fileName?: string };
    }
  | { kind: 'refused'; message: string };

/**
 * Listen (a few seconds, with a progress ring and a way to stop early) or pick a recording; the
 * sound is analysed at once and only its spectrum is kept (state/soundSpeed.ts). Problems get a
 * sentence of their own; microphone problems point to the file route beside the button.
 */
export function ListenControls({ capture }: Props) {
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const session = useRef<ListeningSession | null>(null);
  const live = useRef(true);
  const limits = { maxFileBytes: MAX_SOUND_FILE_BYTES, maxRecordingS: MAX_RECORDING_S };

  // Leaving the screen while listening drops the recording and releases the microphone.
  useEffect(() => {
    live.current = true;
    return () => {
      live.current = false;
      session.current?.cancel();
    };
  }, []);

  const show = (next: Status) => live.current && setStatus(next);

  const analyse = (recording: SoundRecording, source: 'microphone' | 'file', fileName?: string) => {
    const spectrum = attempt(() => soundSpectrum(recording.samples, recording.sampleRateHz));
    if (!spectrum.ok) return show({ kind: 'refused', message: spectrum.message });
    heardSound.value = {
      spectrum: spectrum.result,
      source,
      ...(fileName !== undefined ? { fileName } : {}),
      heardAtMs: Date.now(),
    };
    show({ kind: 'idle' });
  };

  const failed = (error: unknown, source: 'microphone' | 'file', fileName?: string) => {
    if (!(error instanceof SoundCaptureError)) {
      return show({ kind: 'refused', message: 'The sound could not be read in this browser.' });
    }
    if (error.code === 'cancelled') return show({ kind: 'idle' });
    show({
      kind: 'problem',
      code: error.code,
      ...(error.recording ? { kept: { recording: error.recording, source, fileName } } : {}),
    });
  };

  const listen = () => {
    const started = capture.listen({
      seconds: LISTEN_S,
      onProgress: (recordedS, totalS) => show({ kind: 'listening', recordedS, totalS }),
    });
    session.current = started;
    show({ kind: 'listening', recordedS: 0, totalS: LISTEN_S });
    started.recording
      .then(
        (recording) => analyse(recording, 'microphone'),
        (error: unknown) => failed(error, 'microphone'),
      )
      .finally(() => {
        if (session.current === started) session.current = null;
      });
  };

  const pick = (input: HTMLInputElement) => {
    const file = input.files?.[0];
    // The same file may be picked again later: the input forgets it.
    input.value = '';
    if (!file) return;
    show({ kind: 'reading', fileName: file.name });
    capture.decodeFile(file).then(
      (recording) => analyse(recording, 'file', file.name),
      (error: unknown) => failed(error, 'file', file.name),
    );
  };

  const busy = status.kind === 'listening' || status.kind === 'reading';
  return (
    <div class={style.controls}>
      {status.kind === 'listening' ? (
        <div class={style.listening} data-testid="listening">
          <ProgressRing doneS={status.recordedS} totalS={status.totalS} />
          <div class={style.listeningWords}>
            <p>Listening… hold the phone still, pointed at the part.</p>
            <button type="button" class={style.quietButton} onClick={() => session.current?.stop()}>
              Stop now and use what was heard
            </button>
          </div>
        </div>
      ) : (
        <button type="button" class={style.listen} disabled={busy} onClick={listen}>
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
      {status.kind === 'reading' && (
        <p class={style.quiet} role="status">
          Reading “{status.fileName}”…
        </p>
      )}
      {status.kind === 'problem' && (
        <div class={style.problem} role="alert" data-testid="sound-problem" data-code={status.code}>
          <p>{captureProblemWords(status.code, limits)}</p>
          {status.kept && (
            <button
              type="button"
              class={style.quietButton}
              onClick={() =>
                analyse(status.kept!.recording, status.kept!.source, status.kept!.fileName)
              }
            >
              Analyse it anyway
            </button>
          )}
        </div>
      )}
      {status.kind === 'refused' && (
        <p class={style.problem} role="alert" data-testid="sound-problem">
          {status.message}
        </p>
      )}
    </div>
  );
}
