import { soundPanelOpen } from '../../../state/soundSpeed';
import { featuresInUse, finderPartKind } from '../../../state/speedFinder';
import { Panel } from '../../../ui/panel';
import { FEATURE_WORDS, TONE_NAMES } from '../../../words/sound';
import { soundKit } from './load';
import style from './style.module.css';

/**
 * The speed finder's second method, by sound (docs/physics.md §11): closed, a line and a
 * button; opened, its code loads (kept out of the first paint), and the user listens or picks
 * a recording, then sees the spectrum and every speed that explains it.
 */
export function SoundPanel() {
  const n = featuresInUse.value;
  const kind = finderPartKind.value;
  const count = `${n} ${n === 1 ? FEATURE_WORDS[kind].one : FEATURE_WORDS[kind].many}`;
  return (
    <Panel title="By sound" id="finder-sound">
      {soundPanelOpen.value ? (
        <OpenPanel count={count} />
      ) : (
        <>
          <p class={style.quiet}>
            A turning part sings: its {TONE_NAMES[kind]} gives the speed in a few seconds, and one
            strobe reading then confirms it.
          </p>
          <button type="button" class={style.open} onClick={() => (soundPanelOpen.value = true)}>
            Find the speed by sound
          </button>
        </>
      )}
    </Panel>
  );
}

function OpenPanel({ count }: { count: string }) {
  const { module: kit, failed } = soundKit.use();
  if (kit) return <kit.OpenSound count={count} />;
  return (
    <p class={style.quiet} role="status">
      {failed
        ? 'The sound method could not be loaded: reload the page to try again.'
        : 'Getting the sound method ready…'}
    </p>
  );
}
