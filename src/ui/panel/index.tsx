import type { ComponentChildren } from 'preact';
import style from './style.module.css';

interface Props {
  /** Heading text; also names the region for screen readers. */
  title: string;
  id: string;
  children: ComponentChildren;
  /** Extra class for the layout that places the panel. */
  class?: string;
}

/** A titled card: the building block of every screen. */
export function Panel({ title, id, children, class: extra }: Props) {
  return (
    <section
      class={extra ? `${style.panel} ${extra}` : style.panel}
      aria-labelledby={`${id}-title`}
    >
      <h2 id={`${id}-title`} class={style.title}>
        {title}
      </h2>
      {children}
    </section>
  );
}
