// Queries the screen tests share: a field by its exact label, typing into it (one input event,
// as a keystroke gives), and the body rows of a table found by its test id.
import { fireEvent, screen, within } from '@testing-library/preact';

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
