// @vitest-environment happy-dom
import { signal } from '@preact/signals';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/preact';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { Preview } from '../../../src/screens/check/preview';
import { reportIntersections } from '../../helpers/intersection';

beforeEach(() => reportIntersections());

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// A fictional packing-line fan: 6 blades at 1780 rpm.
const fan = { speedHz: 1780 / 60, symmetry: 6 };

describe('Preview', () => {
  it('shows the sampled view beside the true one, with what the sampled view shows in words', () => {
    render(<Preview part={fan} sampler="flash" rateHz={1780 / 60} exposureS={0} />);
    // 6 blades at one turn per flash: a single image standing still.
    expect(screen.getByRole('img', { name: /As the flashes show it: looks still/ })).toBeTruthy();
    expect(screen.getByRole('img', { name: 'As it really turns' })).toBeTruthy();
  });

  it('steps one flash at a time and shows the sample count and the part’s clock', async () => {
    render(<Preview part={fan} sampler="flash" rateHz={100} exposureS={0} />);
    const next = screen.getByRole('button', { name: 'Next flash' });
    fireEvent.click(next);
    fireEvent.click(next);
    fireEvent.click(next);
    expect(screen.getByRole('button', { name: 'Play' }).getAttribute('aria-pressed')).toBe('false');
    // The counter follows with the next frame drawn (once the preview is known to be on screen).
    await waitFor(() =>
      expect(screen.getByTestId('preview-counter').textContent).toBe(
        'Flash 3 · 0.03 s · real time',
      ),
    );
  });

  it('draws nothing while it is off screen', async () => {
    reportIntersections(false);
    render(<Preview part={fan} sampler="flash" rateHz={100} exposureS={0} />);
    fireEvent.click(screen.getByRole('button', { name: 'Next flash' }));
    for (let i = 0; i < 4; i++) await new Promise((resolve) => requestAnimationFrame(resolve));
    // Nothing was drawn: the counter still holds what the first render wrote.
    expect(screen.getByTestId('preview-counter').textContent).toBe('Flash 0 · 0 s · real time');
  });

  it('names frames for a camera and offers slowed playback', () => {
    render(<Preview part={fan} sampler="frames" rateHz={30} exposureS={1 / 250} readoutS={0.03} />);
    expect(screen.getByRole('button', { name: 'Next frame' })).toBeTruthy();
    const pace = screen.getByLabelText('Playback') as HTMLSelectElement;
    expect([...pace.options].map((o) => o.textContent)).toEqual([
      'Real time',
      '2× slower',
      '5× slower',
      '10× slower',
      '30× slower',
      '100× slower',
    ]);
  });

  it('starts paused when a strobe would flash at 3–60 a second, and warns once it plays', () => {
    render(<Preview part={fan} sampler="flash" rateHz={30} exposureS={0} />);
    const play = screen.getByRole('button', { name: 'Play' });
    expect(screen.queryByText(/photosensitive epilepsy/)).toBeNull();
    fireEvent.click(play);
    expect(screen.getByRole('button', { name: 'Pause' }).getAttribute('aria-pressed')).toBe('true');
    expect(screen.getByText(/photosensitive epilepsy/)).toBeTruthy();
  });

  it('warns that a part which looks still is still turning, and leaves a faithful view alone', () => {
    const { rerender } = render(
      <Preview part={fan} sampler="frames" rateHz={1780 / 60} exposureS={0} />,
    );
    expect(screen.getByText(/still turning at full speed/)).toBeTruthy();
    // 6 blades at 29.7 rev/s: a camera above 2·n·f = 356 frames/s shows the true motion.
    rerender(<Preview part={fan} sampler="frames" rateHz={1000} exposureS={0} />);
    expect(screen.queryByText(/still turning at full speed/)).toBeNull();
  });

  it('leaves the stillness caution to the screen when told, but always warns of its own flashing', () => {
    render(<Preview part={fan} sampler="flash" rateHz={30} exposureS={0} showCautions={false} />);
    // 6 blades at 29.67 rev/s under 30 flashes a second do not look true: the screen says so beside.
    expect(screen.queryByText(/still turning at full speed/)).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Play' }));
    // Played in real time the preview flashes 30 times a second: only the preview knows it.
    expect(screen.getByText(/photosensitive epilepsy/)).toBeTruthy();
  });

  it('follows a caution flag handed over as a signal', async () => {
    const give = signal(true);
    render(<Preview part={fan} sampler="flash" rateHz={30} exposureS={0} showCautions={give} />);
    expect(screen.getByText(/still turning at full speed/)).toBeTruthy();
    give.value = false;
    await waitFor(() => expect(screen.queryByText(/still turning at full speed/)).toBeNull());
    give.value = true;
    await waitFor(() => expect(screen.getByText(/still turning at full speed/)).toBeTruthy());
  });

  it('says what is wrong instead of drawing when a setting cannot be drawn', () => {
    render(
      <Preview part={{ speedHz: 10, symmetry: 2.5 }} sampler="flash" rateHz={50} exposureS={0} />,
    );
    expect(screen.getByRole('alert').textContent).toMatch(/features/);
    expect(screen.queryByRole('button', { name: 'Next flash' })).toBeNull();
  });
});
