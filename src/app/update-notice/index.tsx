import type { ComponentChildren } from 'preact';
import { useRef } from 'preact/hooks';
import { useFloatInset } from './float-inset';
import style from './style.module.css';

interface Props {
  /** A newer version is installed and waits. */
  updateReady: boolean;
  /** The app has just been stored for offline use. */
  offlineReady: boolean;
  onUpdate: () => void;
  onDismiss: () => void;
}

/** Tells the user the app works offline, or that a newer version is ready, in our own words. */
export function UpdateNotice({ updateReady, offlineReady, onUpdate, onDismiss }: Props) {
  if (!updateReady && !offlineReady) return null;
  return (
    <FloatingNotice>
      {updateReady ? (
        <>
          <p class={style.text}>
            <strong>A newer Trueturn is ready.</strong> Your saved machines stay as they are.
          </p>
          <div class={style.actions}>
            <button type="button" class={style.primary} onClick={onUpdate}>
              Switch now
            </button>
            <button type="button" class={style.secondary} onClick={onDismiss}>
              Later
            </button>
          </div>
        </>
      ) : (
        <>
          <p class={style.text}>
            <strong>Stored on this device.</strong> Trueturn now works with no network.
          </p>
          <div class={style.actions}>
            <button type="button" class={style.secondary} onClick={onDismiss}>
              Fine
            </button>
          </div>
        </>
      )}
    </FloatingNotice>
  );
}

/**
 * The notice's box, floating at the foot of the window with room kept for it. Not printed: it
 * would stand over the report on every page.
 */
function FloatingNotice({ children }: { children: ComponentChildren }) {
  const box = useRef<HTMLDivElement>(null);
  useFloatInset(box);
  return (
    <div class={style.notice} role="status" data-testid="update-notice" data-print="hide" ref={box}>
      {children}
    </div>
  );
}
