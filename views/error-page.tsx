/** The error page body: status, a message safe to show, a way back. Never a stack trace. */
import type { FC } from 'hono/jsx';

export const ErrorBody: FC<{ status: number; title: string; message: string }> = ({
  status,
  title,
  message,
}) => (
  <section id="results" class="error-page" data-status={String(status)}>
    <h1>
      {status} · {title}
    </h1>
    <p>{message}</p>
    <p>
      <a href="/">Back to the demo study</a>
    </p>
  </section>
);
