import { describe, expect, it } from 'vitest';
import { ScenarioError } from '../../estimator/io/ScenarioError.js';

describe('ScenarioError', () => {
  it('keeps one problem per line and the file name', () => {
    const error = new ScenarioError('a.json', ['a.json:3: x: bad', 'a.json:4: y: worse']);
    expect(error.message).toBe('a.json:3: x: bad\na.json:4: y: worse');
    expect(error.problems).toHaveLength(2);
    expect(error.fileName).toBe('a.json');
    expect(error.name).toBe('ScenarioError');
  });
});
