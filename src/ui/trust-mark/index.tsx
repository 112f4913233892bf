import type { Trust } from '../../state/check';
import style from './style.module.css';

interface Props {
  trust: Trust;
}

/**
 * A shape for each trust level, so the verdict never relies on colour alone: a ring for
 * "trust what you see", a half-filled ring for "caution", a bar-and-dot for "danger".
 */
export function TrustMark({ trust }: Props) {
  return (
    <svg class={style.mark} viewBox="0 0 32 32" aria-hidden="true" data-trust={trust}>
      <circle cx="16" cy="16" r="13" fill="none" stroke="currentColor" stroke-width="4" />
      {trust === 'trust' && (
        <path
          d="M9.5 16.5l4.5 4.5 8.5-9"
          fill="none"
          stroke="currentColor"
          stroke-width="4"
          stroke-linecap="round"
          stroke-linejoin="round"
        />
      )}
      {trust === 'caution' && <path d="M16 3a13 13 0 0 1 0 26z" fill="currentColor" />}
      {trust === 'danger' && (
        <>
          <path d="M16 8.5v9" stroke="currentColor" stroke-width="4" stroke-linecap="round" />
          <circle cx="16" cy="23" r="2.4" fill="currentColor" />
        </>
      )}
    </svg>
  );
}
