/**
 * The plot components of the candidate sheet's simulation sections, on data built here: engineering-unit
 * axes, trace thinning that keeps every extreme (against an obvious per-column scan), label spreading,
 * phase unwrapping, the SVG structure of the time and Bode plots, and the transient wording.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BodePlot, unwrapPhase } from '../../views/plots/bode-plot.tsx';
import { decimateMinMax } from '../../views/plots/decimate.ts';
import { decimalsFor, engineeringAxis, unitScale } from '../../views/plots/eng-axis.ts';
import { spreadLabels, TimePlot } from '../../views/plots/time-plot.tsx';
import { describeTransient, ringingVerdict } from '../../views/waves/transient-words.ts';

const html = (node: unknown) => String(node);

describe('engineering axes', () => {
  // Prefixes: SI Brochure, BIPM, 9th ed. 2019, table 7 (µ = 10⁻⁶, n = 10⁻⁹, m = 10⁻³).
  it('picks one prefix per axis so the largest tick reads 1…999', () => {
    expect(unitScale(2.5e-6, 's')).toEqual({ factor: 1e-6, symbol: 'µs' });
    expect(unitScale(8e-7, 's').symbol).toBe('ns');
    expect(unitScale(1e-6, 's').symbol).toBe('µs');
    expect(unitScale(0.02, 'V').symbol).toBe('mV');
    expect(unitScale(3.2, 'A').symbol).toBe('A');
    expect(unitScale(0, 'A').symbol).toBe('A');
  });

  it('labels ticks as plain numbers in that prefix, with the unit in the title', () => {
    const axis = engineeringAxis([0, 2.5e-6], [0, 500], { unit: 's', quantity: 'Time' });
    expect(axis.title).toBe('Time (µs)');
    expect(axis.ticks.map(axis.label)).toEqual(['0.0', '0.5', '1.0', '1.5', '2.0', '2.5']);
    const ripple = engineeringAxis([-0.012, 0.012], [200, 0], { unit: 'V', quantity: 'Ripple', count: 5 });
    expect(ripple.title).toBe('Ripple (mV)');
    expect(ripple.ticks.map(ripple.label)).toContain('-10');
    expect(ripple.ticks.map(ripple.label)).toContain('0');
  });

  it('gives each tick step the decimals it needs', () => {
    expect(decimalsFor(5)).toBe(0);
    expect(decimalsFor(0.5)).toBe(1);
    expect(decimalsFor(0.25)).toBe(2);
    expect(decimalsFor(0.2)).toBe(1);
  });
});

describe('trace thinning', () => {
  /** The slow obvious reference: the samples of each pixel column, scanned one by one. */
  function columnsOf(t: number[], columns: number): number[][] {
    const span = t[t.length - 1] - t[0];
    const out: number[][] = Array.from({ length: columns }, () => []);
    t.forEach((ti, i) => {
      out[Math.min(columns - 1, Math.floor(((ti - t[0]) / span) * columns))].push(i);
    });
    return out;
  }

  it('keeps the first, last, smallest and largest sample of every column, in time order', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 50, maxLength: 3000 }),
        fc.integer({ min: 2, max: 40 }),
        (values, columns) => {
          const t = values.map((_, i) => i * 1e-7);
          const keep = decimateMinMax(t, values, columns);
          expect([...keep].sort((a, b) => a - b)).toEqual(keep);
          if (values.length <= 4 * columns) {
            expect(keep.length).toBe(values.length);
            return;
          }
          const kept = new Set(keep);
          for (const col of columnsOf(t, columns)) {
            if (col.length === 0) continue;
            const vs = col.map((i) => values[i]);
            expect(kept.has(col[0])).toBe(true);
            expect(kept.has(col[col.length - 1])).toBe(true);
            expect(col.some((i) => kept.has(i) && values[i] === Math.min(...vs))).toBe(true);
            expect(col.some((i) => kept.has(i) && values[i] === Math.max(...vs))).toBe(true);
          }
          expect(keep.length).toBeLessThanOrEqual(4 * columns);
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe('label spreading', () => {
  it('keeps labels at least the gap apart and inside the frame, in the order of their traces', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 200, noNaN: true }), { maxLength: 6 }), (ys) => {
        const placed = spreadLabels(ys, 12, 10, 200);
        const sorted = [...placed].sort((a, b) => a - b);
        for (let k = 1; k < sorted.length; k++)
          expect(sorted[k] - sorted[k - 1]).toBeGreaterThanOrEqual(12 - 1e-9);
        for (const y of placed) expect(y).toBeLessThanOrEqual(200 + 1e-9);
        const byWish = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
        for (let k = 1; k < byWish.length; k++)
          expect(placed[byWish[k].i]).toBeGreaterThanOrEqual(placed[byWish[k - 1].i]);
      }),
    );
  });
});

describe('phase unwrapping', () => {
  it('undoes the ±180° wrap of a phase that falls through −450°', () => {
    const truth = Array.from({ length: 200 }, (_, i) => -10 - i * 2.5);
    const wrapped = truth.map((p) => ((((p + 180) % 360) + 360) % 360) - 180);
    const unwrapped = unwrapPhase(wrapped);
    unwrapped.forEach((p, i) => {
      expect(p).toBeCloseTo(truth[i], 9);
    });
  });
});

describe('time plot', () => {
  const n = 401;
  const T = 2.5e-6;
  const timeS = Array.from({ length: n }, (_, i) => (i / (n - 1)) * T);
  const tri = timeS.map((t) => 1.8 + 0.3 * (t < T / 2 ? (4 * t) / T - 1 : 3 - (4 * t) / T));
  const svg = html(
    <TimePlot
      caption="Inductor currents over one period."
      timeS={timeS}
      unit="A"
      quantity="Current"
      traces={[
        { signal: 'L1.i', tag: 'i L1', words: 'L1 current (input inductor)', values: tri },
        { signal: 'L2.i', tag: 'i L2', words: 'L2 current', values: tri.map((v) => v - 0.2) },
      ]}
      timeMarks={[{ timeS: 1e-6, label: 'step' }]}
    />,
  );

  it('has engineering-unit axis titles and every trace named beside it, not by colour only', () => {
    expect(svg).toContain('Time (µs)');
    expect(svg).toContain('Current (A)');
    expect(svg).toMatch(/<g class="trace" data-signal="L1.i">/);
    expect(svg).toMatch(/<text class="trace-label"[^>]*>i L1<\/text>/);
    expect(svg).toMatch(/<text class="trace-label"[^>]*>i L2<\/text>/);
    // The second trace differs by dash pattern as well as colour.
    expect(svg).toMatch(/data-signal="L2.i">[\s\S]*?stroke-dasharray="7 3"/);
    expect(svg).toContain('role="img"');
    expect(svg).toContain('>step</text>');
  });

  it('draws every sample of a short period', () => {
    const first = svg.match(/<polyline points="([^"]+)"/)![1];
    expect(first.split(' ').length).toBe(n);
  });
});

describe('Bode plot', () => {
  const freqHz = Array.from({ length: 121 }, (_, i) => 10 * 10 ** (i / 24));
  const magDb = freqHz.map((f) => 20 - 40 * Math.log10(1 + f / 3e3));
  const phaseDeg = freqHz.map((f) => -Math.atan(f / 3e3) * (180 / Math.PI) * 3);
  const svg = html(
    <BodePlot
      caption="Control to output."
      freqHz={freqHz}
      curves={[{ key: 'control', words: 'control to output', magDb, phaseDeg }]}
      marks={[
        { kind: 'crossover', freqHz: 4.1e3, label: 'suggested crossover 4.1 kHz' },
        { kind: 'rhp-zero', freqHz: 20.5e3, label: 'RHP zero 20.5 kHz' },
      ]}
    />,
  );

  it('labels magnitude, phase and the log frequency axis with their units', () => {
    expect(svg).toContain('Magnitude (dB)');
    expect(svg).toContain('Phase (°)');
    expect(svg).toContain('Frequency (Hz)');
    expect(svg).toContain('>1 kHz<');
    expect(svg).toContain('>100 kHz<');
  });

  it('marks and names the RHP zero where it is on the log axis', () => {
    const mark = svg.match(/<g class="freq-mark rhp-zero" data-freq-hz="20500">\s*<line x1="([\d.]+)"/);
    expect(mark).not.toBeNull();
    const tick = (label: string) => {
      const m = svg.match(new RegExp(`<text x="([\\d.]+)"[^>]*>${label}</text>`));
      return Number(m![1]);
    };
    // log10(20.5 k / 10 k) / log10(100 k / 10 k) of the way from the 10 kHz to the 100 kHz tick.
    const expected = tick('10 kHz') + Math.log10(2.05) * (tick('100 kHz') - tick('10 kHz'));
    expect(Number(mark![1])).toBeCloseTo(expected, 6);
    expect(svg).toContain('RHP zero 20.5 kHz');
    expect(svg).toContain('suggested crossover 4.1 kHz');
  });
});

describe('transient wording', () => {
  it('says the separate-inductor SEPIC rings towards twice the step and names both remedies', () => {
    const text = ringingVerdict('sepic', 1.91)!;
    expect(text).toContain('1.91 ×');
    expect(text).toContain('2 ×');
    expect(text).toContain('coupled inductor');
    expect(text).toContain('damping leg');
  });

  it('says the damped SEPIC is well damped, with its number', () => {
    expect(ringingVerdict('sepic-damped', 1.12)).toMatch(/^Well damped.*1\.12 ×/);
    expect(ringingVerdict('sepic-damped', 1.7)).toContain('only partly');
  });

  it('reports overshoot, peaks and settling time of a step in words', () => {
    const words = describeTransient({
      analysis: 'step',
      topology: 'sepic',
      overshoot: { 'out.v': 1.6, 'Cs.v': 1.93 },
      peaks: { 'out.v': 19.1, 'Cs.v': 24.4 },
      settlingTimeS: 1.25e-3,
      step: { fromV: 12.8, toV: 19.2, fromSpec: false },
      settled: true,
    }).join(' ');
    expect(words).toContain('from 12.8 V to 19.2 V');
    expect(words).toContain('+50 %');
    expect(words).toContain('peaks at 19.1 V');
    expect(words).toContain('1.60 × the final change (60 % overshoot)');
    expect(words).toContain('1.25 ms');
    expect(words).toContain('Coupling capacitor Cs: peaks at 24.4 V');
    expect(words).toContain('Visible ringing');
  });
});
