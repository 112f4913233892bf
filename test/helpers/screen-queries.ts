// Queries the screen tests share: a field by its exact label, typing into it (one input event,
// as a keystroke gives), and the body rows of a table found by its test id.
import { fireEvent, screen, waitFor, within } from '@testing-library/preact';
import { listsBehind, picturesBehind } from '../../src/state/check';

export function field(label: string): HTMLInputElement {
  return screen.getByLabelText(label, { exact: true }) as HTMLInputElement;
}

export function type(label: string, text: string): void {
  fireEvent.input(field(label), { target: { value: text } });
}

/** The rows of a table below its header row. */
export function tableRows(testId: string): HTMLElement[] {
  return within(screen.getByTestId(testId)).getAllByRole('row').slice(1);
}

/**
 * Waits until the check screen's lists show the set-up on screen: their chunk has loaded and
 * they and the pictures have caught up (they follow a paint or two behind the answer:
 * src/state/check/listed.ts).
 */
export async function listsCaughtUp(): Promise<void> {
  await waitFor(() => {
    if (screen.queryByTestId('results-loading')) throw new Error('the lists have not loaded');
    if (listsBehind.peek()) throw new Error('the lists are a paint behind');
    if (picturesBehind.peek()) throw new Error('the pictures are behind');
    if (document.querySelector('[aria-busy="true"]')) throw new Error('a list is still busy');
  });
}
