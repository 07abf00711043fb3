/** `straddle study` through main() with fake streams: exit 0 on success, 2 on bad input, each option named. */
import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';

const MARINE = 'data/specs/marine-lifepo4-12v.yaml';

function sink() {
  let text = '';
  const stream = new Writable({
    write(chunk, _enc, done) {
      text += chunk.toString();
      done();
    },
  });
  return { stream, text: () => text };
}

async function run(...argv: string[]) {
  const out = sink();
  const err = sink();
  const code = await main(['study', ...argv], out.stream, err.stream);
  return { code, out: out.text(), err: err.text() };
}

const SMALL = ['--frequencies', '3', '--ripple', '0.3'];

describe('straddle study', () => {
  it('writes the study as JSON by default', async () => {
    const r = await run(MARINE, ...SMALL);
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.front.length).toBeGreaterThan(0);
    expect(json.candidates[0].id).toMatch(/^[a-z-]+@[\d.]+[kM]?\/r0\.3\/(diode|sync)$/);
    expect(r.err).toBe(''); // not a TTY: no progress bar
  });

  it('writes CSV and Markdown on request', async () => {
    const csv = await run(MARINE, ...SMALL, '--format', 'csv');
    expect(csv.code).toBe(0);
    expect(csv.out.split('\r\n')[0]).toMatch(/^id,topology,fswHz,/);
    const md = await run(
      MARINE,
      ...SMALL,
      '--format',
      'md',
      '--objectives',
      'lossW,volumeMm3',
      '--weights',
      '2,1',
    );
    expect(md.code).toBe(0);
    expect(md.out).toContain('Objectives (minimised): lossW, volumeMm3');
  });

  it.each([
    [['--objectives', 'parts,cost'], '--objectives: unknown objective "cost"'],
    [['--frequencies', '1'], '--frequencies: 1: need an integer of at least 2'],
    [['--band', '1M,100k'], '--band: 1 MHz to 100 kHz is inverted'],
    [['--band', '200k,200k'], '--band: 200 kHz to 200 kHz is empty'],
    [['--frequencies', '4000'], '--max-candidates: 4000 frequencies'],
    [['--weights', '1,1'], '--weights: 2 weights for 3 objectives'],
    [['--ripple', '0.3,x'], '--ripple x: not a number'],
    [['--format', 'xml'], '--format xml: one of json, csv, md'],
  ])('exits 2 on %j naming the option', async (args, message) => {
    const r = await run(MARINE, ...args);
    expect(r.code).toBe(2);
    expect(r.err).toContain(message);
    expect(r.out).toBe('');
  });

  it('exits 2 on a missing spec file', async () => {
    const r = await run('data/specs/no-such-spec.yaml');
    expect(r.code).toBe(2);
    expect(r.err).toContain('cannot read');
  });

  it('draws a progress bar on stderr when stderr is a terminal, and clears it', async () => {
    const out = sink();
    const err = sink();
    Object.assign(err.stream, { isTTY: true });
    const code = await main(['study', MARINE, ...SMALL], out.stream, err.stream);
    expect(code).toBe(0);
    expect(err.text()).toContain('100 %');
    expect(err.text().endsWith('\r\x1b[K')).toBe(true);
  });
});
