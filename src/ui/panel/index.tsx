import type { ComponentChildren } from 'preact';
import style from './style.module.css';

interface Props {
  /** Heading text; also names the region for screen readers. */
  title: string;
  id: string;
  children: ComponentChildren;
  /** Extra class for the layout that places the panel. */
  class?: string;
  /** The heading can take focus from code (tabIndex -1): a place to land when what had focus went away. */
  focusableTitle?: boolean;
}

/** A titled card: the building block of every screen. */
export function Panel({ title, id, children, class: extra, focusableTitle }: Props) {
  return (
    <section
      class={extra ? `${style.panel} ${extra}` : style.panel}
      aria-labelledby={`${id}-title`}
    >
      <h2 id={`${id}-title`} class={style.title} tabIndex={focusableTitle ? -1 : undefined}>
        {title}
      </h2>
      {children}
    </section>
  );
}
