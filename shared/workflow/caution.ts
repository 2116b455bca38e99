/**
 * The caution every public page, e-mail, export, CAP message and webhook carries. Written here
 * once; the short form is for small map images only.
 */
export const publicCaution =
  'This outlook is planning guidance, not a warning. Follow warnings from the national weather service and instructions from your local emergency officials.';

/** The same caution for a 600 px map image, where the full sentence does not fit. */
export const publicCautionShort = 'Planning guidance, not a warning. Follow official warnings and local emergency officials.';
