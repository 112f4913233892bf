// @vitest-environment happy-dom
// useAfterPaint: a change shows one render later, after the paint of the render that made it.
import { cleanup, render } from '@testing-library/preact';
import { afterEach, describe, expect, it } from 'vitest';
import { useAfterPaint } from '../../src/ui/afterPaint';

afterEach(cleanup);

/** Each value the component showed, render by render. */
let shown: string[] = [];

function Shows({ value, itemKey }: { value: { text: string }; itemKey: string }) {
  const later = useAfterPaint(value, itemKey);
  shown.push(later.text);
  return <p>{later.text}</p>;
}

describe('useAfterPaint', () => {
  it('renders a new key with the value before it, then with the new value once effects run', () => {
    shown = [];
    const { rerender, container } = render(<Shows value={{ text: 'a' }} itemKey="1" />);
    expect(shown).toEqual(['a']);
    // rerender runs inside act(), which runs the effects Preact would run after the paint.
    rerender(<Shows value={{ text: 'b' }} itemKey="2" />);
    expect(shown).toEqual(['a', 'a', 'b']);
    expect(container.textContent).toBe('b');
  });

  it('takes a new object under the same key at once: the key says what the value holds', () => {
    shown = [];
    const { rerender } = render(<Shows value={{ text: 'a' }} itemKey="1" />);
    rerender(<Shows value={{ text: 'a, again' }} itemKey="1" />);
    expect(shown).toEqual(['a', 'a, again']);
  });

  it('ends on the newest value when keys change faster than effects run', () => {
    shown = [];
    const { rerender } = render(<Shows value={{ text: 'a' }} itemKey="1" />);
    rerender(<Shows value={{ text: 'b' }} itemKey="2" />);
    rerender(<Shows value={{ text: 'c' }} itemKey="3" />);
    expect(shown.at(-1)).toBe('c');
  });
});
