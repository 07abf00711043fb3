/**
 * Long sweeps as jobs: progress shown and polled, cancel stops it, a finished job's study is served
 * from the cache, and a new job beyond the running limit cancels the oldest.
 */
import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/web/app.ts';
import { demoFormValues, encodeSpec } from '../../src/web/spec-codec.ts';
import { StudyService } from '../../src/web/study-service.ts';

const demo = demoFormValues('marine-lifepo4-12v');
const url = (fields: Record<string, string>, extra = 'fp=4&rp=0.3') =>
  `/study?s=${encodeSpec({ ...demo, ...fields })}&${extra}`;
const post = {
  method: 'POST',
  headers: { origin: 'http://localhost', 'content-type': 'application/x-www-form-urlencoded' },
  body: '',
};

function fresh() {
  // Every sweep becomes a job; slices of 1 ms so a job spans many event-loop turns.
  const service = new StudyService({ inlineCandidates: 0, sliceMs: 1, maxRunningJobs: 2 });
  return { service, app: createApp({ service }) };
}

describe('long sweeps', () => {
  it('shows progress that polls every 300 ms with a cancel button, then the results', async () => {
    const { service, app } = fresh();
    const first = await (await app.request(url({}))).text();
    expect(first).toContain('data-job-state="running"');
    expect(first).toContain('hx-trigger="every 300ms"');
    expect(first).toMatch(/<progress max="\d+" value="\d+"/);
    expect(first).toMatch(/action="\/jobs\/[0-9a-f-]+\/cancel"/);
    const [job] = service.runningJobs();
    await service.settle(job);
    expect(job.state).toBe('done');
    expect(job.done).toBe(job.total);
    const poll = await (
      await app.request(url({}), { headers: { 'HX-Request': 'true', 'HX-Target': 'section#results' } })
    ).text();
    expect(poll).toContain('<svg class="scatter"');
    expect(poll).not.toContain('every 300ms');
  });

  it('cancels a running job and offers to run it again', async () => {
    const { service, app } = fresh();
    await app.request(url({ 'input.min': '9 V' }));
    const [job] = service.runningJobs();
    const res = await app.request(`/jobs/${job.id}/cancel`, post);
    expect(res.status).toBe(200);
    expect(await res.text()).toContain('Sweep cancelled');
    await service.settle(job);
    expect(job.state).toBe('cancelled');
    expect(job.done).toBeLessThan(job.total);
    expect(await (await app.request(url({ 'input.min': '9 V' }))).text()).toContain(
      'data-job-state="cancelled"',
    );
    expect(await (await app.request(`${url({ 'input.min': '9 V' })}&run=1`)).text()).toContain(
      'data-job-state="running"',
    );
    expect((await app.request('/jobs/no-such-job/cancel', post)).status).toBe(404);
  });

  it('answers an export of a study still running with 202 and a page that reloads itself', async () => {
    const { app } = fresh();
    const res = await app.request(url({ 'input.min': '8.5 V' }).replace('/study?', '/study.csv?'));
    expect(res.status).toBe(202);
    expect(await res.text()).toContain('http-equiv="refresh"');
  });

  it('cancels the oldest running job when a new one would exceed the limit', async () => {
    const { service, app } = fresh();
    await app.request(url({ 'input.min': '9.1 V' }));
    await app.request(url({ 'input.min': '9.2 V' }));
    const [oldest] = service.runningJobs();
    await app.request(url({ 'input.min': '9.3 V' }));
    expect(oldest.state).toBe('cancelled');
    expect(service.runningJobs()).toHaveLength(2);
    await Promise.all(service.runningJobs().map((j) => service.settle(j)));
  });
});
