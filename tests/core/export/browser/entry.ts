import { sampleSchedules } from './sample';
(window as unknown as { runSchedules: () => Promise<unknown> }).runSchedules = async () => {
  const r = await sampleSchedules();
  return { pdf: Array.from(r.pdf), xlsx: Array.from(r.xlsx), csv: r.csv };
};
