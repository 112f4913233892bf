// @vitest-environment happy-dom
import { cleanup, fireEvent, render, screen } from '@testing-library/preact';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { UpdateNotice } from '../../src/app/update-notice';

afterEach(cleanup);

describe('the update notice', () => {
  test('says nothing when there is no news', () => {
    render(
      <UpdateNotice
        updateReady={false}
        offlineReady={false}
        onUpdate={() => {}}
        onDismiss={() => {}}
      />,
    );
    expect(screen.queryByTestId('update-notice')).toBeNull();
  });

  test('offers to switch to a newer version, promising the saved machines stay', () => {
    const onUpdate = vi.fn();
    const onDismiss = vi.fn();
    render(
      <UpdateNotice updateReady offlineReady={false} onUpdate={onUpdate} onDismiss={onDismiss} />,
    );
    expect(screen.getByTestId('update-notice').textContent).toMatch(
      /newer Trueturn is ready.*saved machines stay/,
    );
    fireEvent.click(screen.getByRole('button', { name: 'Switch now' }));
    expect(onUpdate).toHaveBeenCalledOnce();
    fireEvent.click(screen.getByRole('button', { name: 'Later' }));
    expect(onDismiss).toHaveBeenCalledOnce();
  });

  test('tells once that the app now works with no network', () => {
    render(
      <UpdateNotice updateReady={false} offlineReady onUpdate={() => {}} onDismiss={() => {}} />,
    );
    expect(screen.getByTestId('update-notice').textContent).toMatch(/works with no network/);
  });
});
