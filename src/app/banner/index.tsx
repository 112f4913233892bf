import type { ComponentChildren } from 'preact';
import style from './style.module.css';

interface Props {
  kind: 'info' | 'problem';
  children: ComponentChildren;
  /** When given, the banner offers to close. */
  onClose?: () => void;
  testId?: string;
}

/** A one-line message across the page: how the session opened, storage problems. */
export function Banner({ kind, children, onClose, testId }: Props) {
  return (
    <div
      class={style.banner}
      data-kind={kind}
      role={kind === 'problem' ? 'alert' : 'status'}
      data-testid={testId}
    >
      <p class={style.text}>{children}</p>
      {onClose && (
        <button type="button" class={style.close} onClick={onClose}>
          Close
        </button>
      )}
    </div>
  );
}
