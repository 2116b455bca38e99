// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SoundingFlags } from './sounding-flags';

describe('SoundingFlags', () => {
  it('when the analysis carries flags, then lists each with its code and message', () => {
    render(<SoundingFlags analysis={{ flags: [{ code: 'HEIGHTS_REPLACED', message: 'Reported heights differ by up to 9000 m.' }, { code: 'CAPE_CLIPPED_AT_TOP', message: 'Still buoyant at the top.' }] }} />);
    expect(screen.getByRole('heading', { name: '2 quality flags' })).toBeTruthy();
    expect(screen.getByText(/Reported heights differ by up to 9000 m\./).textContent).toContain('HEIGHTS_REPLACED');
  });

  it('when the analysis has no flags (or is from an older engine), then shows nothing', () => {
    const { container } = render(<SoundingFlags analysis={{ flags: [] }} />);
    expect(container.textContent).toBe('');
    expect(render(<SoundingFlags analysis={{ cape: 1 }} />).container.textContent).toBe('');
  });
});
