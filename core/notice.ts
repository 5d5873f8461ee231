// The one source of the verification notice and cautions, used by the interface and every export.

export const NOTICE_TITLE = 'PRELIMINARY LAYOUT — VERIFY BEFORE USE';

export const NOTICE_LINES: readonly string[] = [
  'This is a preliminary trench layout for estimating and coordination only; it is not a construction design.',
  "Verify every route, depth, separation and quantity against local codes and each utility owner's standards.",
  'Have existing utilities located through the local one-call service (811 in the US) before any digging.',
  'Trenches 1.5 m (5 ft) deep or more need a protective system (OSHA 29 CFR 1926.652 or the local equivalent).',
  'The final design must be reviewed and sealed by a licensed professional engineer.',
];

/** The notice as one block of plain text (CSV, DXF notes, CLI output). */
export function noticeText(separator = '\n'): string {
  return [NOTICE_TITLE, ...NOTICE_LINES].join(separator);
}
