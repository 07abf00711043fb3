/**
 * The workspace: the rail form (with the demo scenarios) beside the study results, progress or the
 * "fix the input" notice.
 */
import type { Child, FC } from 'hono/jsx';
import { DEMO_SPECS, demoFormValues } from '../src/web/spec-codec.ts';
import { RailForm, type RailFormProps } from './rail-form.tsx';

export const DemoList: FC = () => (
  <nav class="demos" aria-label="Demo scenarios">
    <h2>Demo scenarios</h2>
    <ul>
      {DEMO_SPECS.map((d) => (
        <li>
          <a href={`/study?demo=${d}`} hx-get={`/study?demo=${d}`} hx-target="#main" hx-push-url="true">
            {demoFormValues(d).name ?? d}
          </a>
        </li>
      ))}
    </ul>
  </nav>
);

export const Workspace: FC<RailFormProps & { results: Child }> = ({ results, ...form }) => (
  <div class="workspace">
    <aside class="spec-pane">
      <h1>Rail spec</h1>
      <DemoList />
      <RailForm {...form} />
    </aside>
    <div class="results-pane">{results}</div>
  </div>
);
