/**
 * A simulated run as CSV (RFC 4180, CRLF): one row per sample, time then every signal in name order,
 * the unit in each column header (`time_s`, `L1.i_A`, `sw.v_V`). Samples at a switching edge appear twice
 * (before and after), exactly as the engine records them.
 */
import type { SimulationResult } from '../../simulate/types.ts';

function unitSuffix(signal: string): string {
  if (signal.endsWith('.i')) return '_A';
  if (signal.endsWith('.v')) return '_V';
  return '';
}

export function renderSimulationCsv(r: SimulationResult): string {
  const names = Object.keys(r.signals).sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
  const lines = [['time_s', ...names.map((n) => `${n}${unitSuffix(n)}`)].join(',')];
  for (let k = 0; k < r.timeS.length; k++) {
    lines.push([r.timeS[k], ...names.map((n) => r.signals[n][k])].map((v) => String(v)).join(','));
  }
  return `${lines.join('\r\n')}\r\n`;
}
