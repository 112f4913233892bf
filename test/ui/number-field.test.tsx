// @vitest-environment happy-dom
import { cleanup, fireEvent, render, screen } from '@testing-library/preact';
import { useState } from 'preact/hooks';
import { afterEach, describe, expect, test } from 'vitest';
import { numberForField } from '../../src/words/format';
import { readFeatures } from '../../src/ui/fields';
import { clearFieldProblems, fieldProblems } from '../../src/state/fieldProblems';
import { NumberField } from '../../src/ui/number-field';

afterEach(() => {
  cleanup();
  clearFieldProblems();
});

/** A field bound to local state, with a button that changes the value from outside. */
function Harness({ onValues }: { onValues: number[] }) {
  const [value, setValue] = useState(6);
  return (
    <>
      <NumberField
        id="features"
        label="Blades"
        value={value}
        toText={numberForField}
        read={readFeatures}
        onValue={(v) => {
          onValues.push(v);
          setValue(v);
        }}
      />
      <output data-testid="value">{value}</output>
      <button type="button" onClick={() => setValue(12)}>
        outside
      </button>
    </>
  );
}

function type(text: string) {
  fireEvent.input(screen.getByLabelText('Blades'), { target: { value: text } });
}

describe('NumberField', () => {
  test('passes each good keystroke on at once', () => {
    const values: number[] = [];
    render(<Harness onValues={values} />);
    type('8');
    expect(values).toEqual([8]);
    expect(screen.getByTestId('value').textContent).toBe('8');
  });

  test('shows a message beside the field for bad text and keeps the last good value', () => {
    const values: number[] = [];
    render(<Harness onValues={values} />);
    type('2.5');
    const input = screen.getByLabelText('Blades') as HTMLInputElement;
    expect(input.getAttribute('aria-invalid')).toBe('true');
    const alert = screen.getByRole('alert');
    expect(alert.textContent).toMatch(/whole number/);
    expect(input.getAttribute('aria-describedby')).toContain(alert.id);
    expect(screen.getByTestId('value').textContent).toBe('6');
    expect(input.value).toBe('2.5');
    expect(values).toEqual([]);
  });

  test('clears the message once the text is good again', () => {
    render(<Harness onValues={[]} />);
    type('x');
    expect(screen.queryByRole('alert')).not.toBeNull();
    type('7');
    expect(screen.queryByRole('alert')).toBeNull();
    expect(
      (screen.getByLabelText('Blades') as HTMLInputElement).getAttribute('aria-invalid'),
    ).toBeNull();
  });

  test('follows a change from outside, replacing even bad text', () => {
    render(<Harness onValues={[]} />);
    type('abc');
    fireEvent.click(screen.getByText('outside'));
    expect((screen.getByLabelText('Blades') as HTMLInputElement).value).toBe('12');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  test('keeps the text as typed when it already says the value (no rewriting under the cursor)', () => {
    render(<Harness onValues={[]} />);
    type('08');
    expect((screen.getByLabelText('Blades') as HTMLInputElement).value).toBe('08');
  });

  test('lists refused text among the page’s refused fields, by id and label, until the text is good again', () => {
    // docs/physics.md §10: results worked out from a refused field are withdrawn; they learn of it here.
    render(<Harness onValues={[]} />);
    expect(fieldProblems.value).toEqual([]);
    type('2.5');
    expect(fieldProblems.value).toEqual([
      { id: 'features', label: 'Blades', message: expect.stringMatching(/whole number/) },
    ]);
    type('7');
    expect(fieldProblems.value).toEqual([]);
  });

  test('drops its refusal from the list when its text is rewritten from outside or it leaves the page', () => {
    const { unmount } = render(<Harness onValues={[]} />);
    type('abc');
    expect(fieldProblems.value.map((p) => p.id)).toEqual(['features']);
    fireEvent.click(screen.getByText('outside'));
    expect(fieldProblems.value).toEqual([]);
    type('abc');
    expect(fieldProblems.value).toHaveLength(1);
    unmount();
    expect(fieldProblems.value).toEqual([]);
  });
});
