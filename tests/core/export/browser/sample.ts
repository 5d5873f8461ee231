// The sample take-off both the Node test and the browser page write (same input, same bytes).
import { computeTakeOff } from '../../../../core/takeoff/takeoff';
import { writeReportPdf } from '../../../../core/export/pdf';
import { writeTakeOffXlsx } from '../../../../core/export/xlsx';
import { writeTakeOffCsv } from '../../../../core/export/csv';
import { defaultSettings } from '../../../../core/settings';
import { handNetwork, terminal } from '../../takeoff/handNetwork';

export async function sampleSchedules(): Promise<{ pdf: Uint8Array; xlsx: Uint8Array; csv: string }> {
  const net = handNetwork(
    [{ id: 0, kind: 'connection', x: 0, y: 0, terminalId: 'C' }, { id: 1, kind: 'service', x: 50, y: 20, terminalId: 'S' }],
    [{ from: 0, to: 1, pts: [0, 0, 50, 0, 50, 20], pave: 12 }],
  );
  const terms = [terminal('C', 'connection', ['power', 'water'], 0, 0), terminal('S', 'service', ['power', 'water'], 50, 20)];
  const t = computeTakeOff(net, terms, defaultSettings());
  const meta = { project: 'Browser check', site: 'Test yard', date: '2026-01-15' };
  return { pdf: await writeReportPdf(t, net, meta), xlsx: await writeTakeOffXlsx(t, meta), csv: writeTakeOffCsv(t) };
}
