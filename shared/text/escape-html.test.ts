import { describe, expect, it } from 'vitest';
import { escapeHtml } from './escape-html';

describe('escapeHtml', () => {
  it('when text holds markup, quotes and ampersands, they come out as entity references (HTML5 named and numeric references)', () => {
    expect(escapeHtml(`<img src="x" onerror='a&b'>`)).toBe('&lt;img src=&quot;x&quot; onerror=&#39;a&amp;b&#39;&gt;');
  });

  it('when text is plain, it is unchanged', () => {
    expect(escapeHtml('Level 2 · Scattered — Lower valley')).toBe('Level 2 · Scattered — Lower valley');
  });
});
