import { describe, expect, it } from 'vitest';
import { analysisTextFromFragment, permalinkFragment } from '../../../notebooks/analysis/permalink.js';

describe('permalinkFragment', () => {
  it('round-trips any UTF-8 text through a URL-safe fragment', () => {
    const text = '{"study":"detection","note":"±3σ, 5 m/s² — ok?/+="}\n';
    const fragment = permalinkFragment(text);
    expect(fragment.startsWith('#analysis=')).toBe(true);
    expect(fragment.slice(1)).toMatch(/^analysis=[A-Za-z0-9_-]+$/);
    expect(analysisTextFromFragment(fragment)).toBe(text);
  });

  it('returns null for fragments that carry no analysis and refuses damaged ones', () => {
    expect(analysisTextFromFragment('')).toBeNull();
    expect(analysisTextFromFragment('#study=carrier')).toBeNull();
    expect(() => analysisTextFromFragment('#analysis=abc$def')).toThrow('damaged');
  });
});
