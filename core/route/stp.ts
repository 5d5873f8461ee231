// Reader for the plain-text Steiner instance format (SteinLib / PACE 2018 ".gr" style):
// "SECTION Graph" with "Nodes n", "Edges m", "E u v w" lines (1-based nodes), and
// "SECTION Terminals" with "T v" lines. Unused sections are skipped. Parses from a string;
// file reading belongs to the caller.

import { err, ok, type Result } from '../result';
import { buildGraph, type Graph } from './graph';

export interface SteinerInstance {
  graph: Graph;
  /** 0-based terminal ids. */
  terminals: Int32Array;
}

export type StpError = { kind: 'stp-syntax'; line: number; message: string };

export function parseStp(text: string): Result<SteinerInstance, StpError> {
  const lines = text.split(/\r?\n/);
  let section = '';
  let n = -1;
  const eu: number[] = [];
  const ev: number[] = [];
  const ew: number[] = [];
  const terms: number[] = [];
  const bad = (i: number, message: string) => err<StpError>({ kind: 'stp-syntax', line: i + 1, message });
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    if (line === '' || line.startsWith('#')) continue;
    const f = line.split(/\s+/);
    const head = f[0].toUpperCase();
    if (head === 'SECTION') {
      section = (f[1] ?? '').toUpperCase();
      continue;
    }
    if (head === 'END') {
      section = '';
      continue;
    }
    if (head === 'EOF') break;
    if (section === 'GRAPH') {
      if (head === 'NODES') n = Number(f[1]);
      else if (head === 'E' || head === 'A') {
        const u = Number(f[1]);
        const v = Number(f[2]);
        const w = Number(f[3]);
        if (!Number.isInteger(u) || !Number.isInteger(v) || !Number.isFinite(w)) return bad(i, `bad edge line "${line}"`);
        eu.push(u - 1);
        ev.push(v - 1);
        ew.push(w);
      }
    } else if (section === 'TERMINALS') {
      if (head === 'T') {
        const t = Number(f[1]);
        if (!Number.isInteger(t)) return bad(i, `bad terminal line "${line}"`);
        terms.push(t - 1);
      }
    }
  }
  if (!(n >= 0)) return bad(0, 'missing "Nodes" in SECTION Graph');
  for (let e = 0; e < eu.length; e++) {
    if (eu[e] < 0 || eu[e] >= n || ev[e] < 0 || ev[e] >= n) return bad(0, `edge ${e + 1} (${eu[e] + 1}, ${ev[e] + 1}) outside 1..${n}`);
    if (ew[e] < 0) return bad(0, `edge ${e + 1} has negative weight ${ew[e]}`);
  }
  for (const t of terms) if (t < 0 || t >= n) return bad(0, `terminal ${t + 1} outside 1..${n}`);
  return ok({ graph: buildGraph(n, eu, ev, ew), terminals: Int32Array.from(terms) });
}
