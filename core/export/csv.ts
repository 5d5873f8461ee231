// CSV schedule: one row per line item (RFC 4180 quoting, CRLF), then the total and the notice.

import type { TakeOff } from '../takeoff/takeoff';
import type { Cell } from './scheduleTable';
import { lineItemHeader, lineItemRows } from './scheduleTable';

/** A text cell that a spreadsheet would run as a formula gets a leading apostrophe. */
function field(c: Cell): string {
  if (typeof c === 'number') return Number.isFinite(c) ? String(c) : '';
  let s = c;
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function writeTakeOffCsv(t: TakeOff): string {
  return [lineItemHeader(t), ...lineItemRows(t)].map((r) => r.map(field).join(',')).join('\r\n') + '\r\n';
}
