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
  /**
   * The browser may skip rendering the panel while it is off screen (content-visibility; its
   * content stays in the page and in the accessibility tree): for results that change with every
   * keystroke. Not for panels of controls: off screen, a skipped panel's inner boxes do not stand
   * where they will, and code that measures a control (scrolling it clear of the pinned verdict)
   * would measure wrong.
   */
  offscreenSkipped?: boolean;
}

/** A titled card: the building block of every screen. */
export function Panel({
  title,
  id,
  children,
  class: extra,
  focusableTitle,
  offscreenSkipped,
}: Props) {
  const classes = [style.panel, offscreenSkipped && style.offscreenSkipped, extra].filter(Boolean);
  return (
    <section class={classes.join(' ')} aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} class={style.title} tabIndex={focusableTitle ? -1 : undefined}>
        {title}
      </h2>
      {children}
    </section>
  );
}
