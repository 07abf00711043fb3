// Worker thread around ngspice (eecircuit-engine, WebAssembly): a run blocks its thread for seconds,
// so it lives here and the test's event loop stays free. Plain JavaScript so Node loads it without a
// TypeScript loader. Protocol: { id, text } in; { id, ok, vectors, errors, log } or { id, ok: false, message } out.
import { parentPort } from 'node:worker_threads';
import { Simulation } from 'eecircuit-engine';

// ngspice reports through console.error; keep it off the test output and hand it back with the run.
const captured = [];
const capture = (...args) => {
  captured.push(args.map(String).join(' '));
  if (captured.length > 400) captured.shift();
};
console.log = capture;
console.info = capture;
console.warn = capture;
console.error = capture;

const sim = new Simulation();
await sim.start();
parentPort.postMessage({ id: 0, ok: true, ready: true });

parentPort.on('message', async ({ id, text }) => {
  captured.length = 0;
  try {
    sim.setNetList(text);
    const result = await sim.runSim();
    const vectors = {};
    const transfer = [];
    for (const d of result.data ?? []) {
      if (d.type === 'notype' && d.name !== 'time') continue;
      const a = Float64Array.from(d.values, (v) => (typeof v === 'number' ? v : v.real));
      vectors[d.name] = a;
      transfer.push(a.buffer);
    }
    parentPort.postMessage(
      { id, ok: true, vectors, errors: [...sim.getError()], log: sim.getInfo() },
      transfer,
    );
  } catch (error) {
    parentPort.postMessage({
      id,
      ok: false,
      message: String(error?.stack ?? error),
      log: captured.join('\n'),
    });
  }
});
