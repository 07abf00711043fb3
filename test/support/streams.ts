/** In-memory writable streams for CLI tests. */
import { Writable } from 'node:stream';

export class Capture extends Writable {
  text = '';
  override _write(chunk: Buffer | string, _enc: BufferEncoding, cb: () => void): void {
    this.text += chunk.toString();
    cb();
  }
}

export function streams(): { out: Capture; err: Capture } {
  return { out: new Capture(), err: new Capture() };
}
