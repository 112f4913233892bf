import { SOUND_CAUTION } from '../../../words/cautions';
import { PRIVACY_WORDS } from '../../../words/sound';
import { ListenControls } from './listen-controls';
import { SoundResult } from './sound-result';
import style from './style.module.css';

interface Props {
  /** The part's features in words: "6 blades". */
  count: string;
}

/** The open by-sound panel: the cautions, where the sound goes, Listen or a file, and what was heard. */
export function OpenSound({ count }: Props) {
  return (
    <>
      <aside class={style.caution} aria-label="Before you listen" data-testid="sound-caution">
        <p>{SOUND_CAUTION}</p>
      </aside>
      <p class={style.quiet}>
        For a part with {count} (set under “The part” above). {PRIVACY_WORDS}
      </p>
      <ListenControls />
      <SoundResult />
    </>
  );
}
