// The line-item table shared by the CSV and the XLSX "Line items" sheet, so both carry the same
// rows: header, one row per line item, the total, then the notice (core/notice.ts).

import type { TakeOff } from '../takeoff/takeoff';
import { NOTICE_LINES, NOTICE_TITLE } from '../notice';

export type Cell = string | number;

export interface ScheduleMeta {
  project: string;
  site: string;
  /** Passed in (never read from the clock) so the output is reproducible. */
  date: string;
}

export function lineItemHeader(t: TakeOff): string[] {
  return ['Group', 'Key', 'Description', 'Utility', 'Quantity', 'Unit', `Unit price (${t.currency})`, `Cost (${t.currency})`];
}

export function lineItemRows(t: TakeOff): Cell[][] {
  const rows: Cell[][] = t.lines.map((l) => [l.group, l.key, l.description, l.utility ?? '', l.quantity, l.unit, l.unitPrice, l.cost]);
  rows.push(['Total', 'total', 'Total, at the unit prices given (defaults are PLACEHOLDERS)', '', '', '', '', t.totals.cost]);
  rows.push(['Notice', 'notice', NOTICE_TITLE, '', '', '', '', '']);
  for (const line of NOTICE_LINES) rows.push(['Notice', 'notice', line, '', '', '', '', '']);
  return rows;
}
