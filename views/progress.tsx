/**
 * A long sweep in progress: a progress bar that polls every 300 ms (htmx), a cancel button, and for
 * browsers without JavaScript a refresh link. The poll replaces this block; when the sweep is done the
 * answer is the results instead, which do not poll.
 */
import type { FC } from 'hono/jsx';
import type { Job } from '../src/web/study-service.ts';

export const ProgressPanel: FC<{ job: Job; pollUrl: string; restartUrl: string }> = ({
  job,
  pollUrl,
  restartUrl,
}) => {
  if (job.state === 'cancelled') {
    return (
      <section id="results" class="results progress-panel" data-job-state="cancelled">
        <h2>Sweep cancelled</h2>
        <p>
          Stopped after {job.done} of {job.total} candidates. <a href={restartUrl}>Run it again</a>, or change
          the spec.
        </p>
      </section>
    );
  }
  if (job.state === 'failed') {
    return (
      <section id="results" class="results progress-panel" data-job-state="failed">
        <h2>The sweep failed</h2>
        <p>
          An internal error stopped it after {job.done} of {job.total} candidates; it has been logged.{' '}
          <a href={restartUrl}>Try again</a>.
        </p>
      </section>
    );
  }
  const percent = job.total > 0 ? Math.floor((100 * job.done) / job.total) : 0;
  return (
    <section
      id="results"
      class="results progress-panel"
      data-job-state="running"
      hx-get={pollUrl}
      hx-trigger="every 300ms"
      hx-target="this"
    >
      <h2>Running the study…</h2>
      <p>
        <progress max={job.total} value={job.done} aria-label="Candidates evaluated">
          {percent} %
        </progress>{' '}
        <span class="progress-text">
          {job.done} of {job.total} candidates evaluated ({percent} %)
        </span>
      </p>
      <form
        method="post"
        action={`/jobs/${job.id}/cancel`}
        hx-post={`/jobs/${job.id}/cancel`}
        hx-target="#results"
      >
        <button type="submit">Cancel</button>{' '}
        <noscript>
          <a href={pollUrl}>Refresh</a> to see progress.
        </noscript>
      </form>
    </section>
  );
};

export const FixInputPanel: FC<{ count: number }> = ({ count }) => (
  <section id="results" class="results fix-input" data-state="invalid">
    <h2>Fix the highlighted {count === 1 ? 'field' : 'fields'}</h2>
    <p>
      {count} {count === 1 ? 'problem' : 'problems'} in the spec; each message is beside its field. The study
      runs again as soon as the spec is valid.
    </p>
  </section>
);
