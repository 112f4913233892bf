// @vitest-environment happy-dom
import { cleanup, render, screen } from '@testing-library/preact';
import { afterEach, describe, expect, test } from 'vitest';
import { lazyModule } from '../../src/ui/lazyModule';

afterEach(cleanup);

describe('lazyModule', () => {
  test('asks for the module once, however many callers want it', async () => {
    let requests = 0;
    const lazy = lazyModule(async () => {
      requests++;
      return { answer: 42 };
    });
    const [a, b] = await Promise.all([lazy.load(), lazy.load()]);
    expect(a).toBe(b);
    expect(await lazy.load()).toBe(a);
    expect(requests).toBe(1);
  });

  test('tries again after a failed load', async () => {
    let requests = 0;
    const lazy = lazyModule(async () => {
      requests++;
      if (requests === 1) throw new Error('chunk gone');
      return 'loaded';
    });
    await expect(lazy.load()).rejects.toThrow('chunk gone');
    expect(await lazy.load()).toBe('loaded');
    expect(requests).toBe(2);
  });

  test('renders nothing loaded until the module arrives, then the module, at once on a later mount', async () => {
    const lazy = lazyModule(async () => ({ word: 'ready' }));
    function Shows() {
      const { module, failed } = lazy.use();
      return <p data-testid="shown">{failed ? 'failed' : (module?.word ?? 'waiting')}</p>;
    }
    render(<Shows />);
    expect(screen.getByTestId('shown').textContent).toBe('waiting');
    await screen.findByText('ready');
    cleanup();
    render(<Shows />);
    // Already loaded: no placeholder on the second mount.
    expect(screen.getByTestId('shown').textContent).toBe('ready');
  });

  test('asks for the module in a task after the render, and not at all for a component gone by then', async () => {
    let requests = 0;
    const lazy = lazyModule(async () => {
      requests++;
      return { word: 'ready' };
    });
    function Shows() {
      const { module } = lazy.use();
      return <p data-testid="shown">{module?.word ?? 'waiting'}</p>;
    }
    // render() runs the effects too: the request waits for a task of its own.
    const first = render(<Shows />);
    expect(requests).toBe(0);
    first.unmount();
    await new Promise((done) => setTimeout(done, 20));
    expect(requests).toBe(0);
    render(<Shows />);
    await screen.findByText('ready');
    expect(requests).toBe(1);
  });

  test('reports a failed load to the component', async () => {
    const lazy = lazyModule<{ word: string }>(() => Promise.reject(new Error('offline')));
    function Shows() {
      const { module, failed } = lazy.use();
      return <p data-testid="shown">{failed ? 'failed' : (module?.word ?? 'waiting')}</p>;
    }
    render(<Shows />);
    await screen.findByText('failed');
  });
});
