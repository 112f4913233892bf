// @vitest-environment happy-dom
// Later: parts that arrive together are made a paint apart.
import { render } from 'preact';
import { waitFor } from '@testing-library/preact';
import { describe, expect, it } from 'vitest';
import { Later } from '../../src/ui/later';

describe('Later', () => {
  it('shows nothing in the render that mounts it, and its children once paints have passed', async () => {
    const root = document.createElement('div');
    render(
      <>
        <p>now</p>
        <Later paints={2}>
          <p>later</p>
        </Later>
      </>,
      root,
    );
    expect(root.textContent).toBe('now');
    await waitFor(() => expect(root.textContent).toBe('nowlater'));
    render(null, root);
  });

  it('with no paints to wait, shows its children at once', () => {
    const root = document.createElement('div');
    render(<Later paints={0}>at once</Later>, root);
    expect(root.textContent).toBe('at once');
    render(null, root);
  });
});
