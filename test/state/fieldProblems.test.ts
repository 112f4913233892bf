import { afterEach, describe, expect, test } from 'vitest';
import { effect } from '@preact/signals';
import {
  clearFieldProblems,
  fieldProblems,
  problemsAmong,
  reportFieldProblem,
} from '../../src/state/fieldProblems';

afterEach(clearFieldProblems);

describe('the page’s refused fields', () => {
  test('keeps each field once, in the order first refused, with its newest message', () => {
    reportFieldProblem('speed', { label: 'Speed', message: 'a' });
    reportFieldProblem('creep', { label: 'Creep', message: 'b' });
    reportFieldProblem('speed', { label: 'Speed', message: 'c' });
    expect(fieldProblems.value).toEqual([
      { id: 'speed', label: 'Speed', message: 'c' },
      { id: 'creep', label: 'Creep', message: 'b' },
    ]);
    reportFieldProblem('speed', null);
    expect(fieldProblems.value.map((p) => p.id)).toEqual(['creep']);
  });

  test('gives the refused fields among some ids, or all of them without ids', () => {
    reportFieldProblem('speed', { label: 'Speed', message: 'a' });
    reportFieldProblem('creep', { label: 'Creep', message: 'b' });
    expect(problemsAmong(['features', 'creep']).map((p) => p.id)).toEqual(['creep']);
    expect(problemsAmong().map((p) => p.id)).toEqual(['speed', 'creep']);
    expect(problemsAmong(['features'])).toEqual([]);
  });

  test('wakes readers only on a real change: the same refusal again, or clearing a good field, writes nothing', () => {
    let runs = 0;
    const stop = effect(() => {
      void fieldProblems.value;
      runs++;
    });
    reportFieldProblem('speed', { label: 'Speed', message: 'a' });
    reportFieldProblem('speed', { label: 'Speed', message: 'a' });
    reportFieldProblem('features', null);
    stop();
    expect(runs).toBe(2);
  });
});
