/**
 * The waveform engine on the candidate sheet: three sections (one-period waveforms, transients, Bode)
 * that the sheet first paints as placeholders; htmx loads each from its own URL once the page is up
 * (`hx-trigger="load"`), and the placeholder's link opens the same section as a page without JavaScript.
 * A simulation that fails shows its message inside its section, never an error page.
 */
import type { Child, FC } from 'hono/jsx';
import { SafetyNote } from './layout.tsx';

export type SimSectionId = 'waveforms' | 'transients' | 'bode';

export const SIM_SECTIONS: Readonly<Record<SimSectionId, { title: string; path: string; what: string }>> = {
  waveforms: {
    title: 'Waveforms over one switching period',
    path: '/waveforms',
    what: 'the one-period waveforms',
  },
  transients: { title: 'Start-up and input step', path: '/transients', what: 'the transients' },
  bode: { title: 'Small-signal response (Bode)', path: '/bode', what: 'the Bode plot' },
};

/** A simulation's answer as data: its value, or the message the user sees instead. */
export type Outcome<T> = { ok: true; value: T } | { ok: false; message: string };

/** Placeholder the sheet paints at once; htmx replaces it with the section from `href`. */
export const LazySimSection: FC<{ id: SimSectionId; href: string }> = ({ id, href }) => {
  const s = SIM_SECTIONS[id];
  return (
    <section
      id={id}
      class="sim-section"
      data-state="pending"
      hx-get={href}
      hx-trigger="load"
      hx-target="this"
      hx-swap="outerHTML"
    >
      <h2>{s.title}</h2>
      <p class="sim-pending">
        <span class="spinner" aria-hidden="true">
          ◌
        </span>{' '}
        Simulating… or <a href={href}>open {s.what} on their own page</a>.
      </p>
    </section>
  );
};

/** A failed simulation, said in words where its plots would be. */
export const SimulationMessage: FC<{ message: string }> = ({ message }) => (
  <p class="sim-error" role="alert">
    {message}
  </p>
);

/** The frame every loaded section shares: its id (the htmx target), heading and state. */
export const SimSection: FC<{ id: SimSectionId; ok: boolean; children?: Child }> = ({ id, ok, children }) => (
  <section id={id} class="sim-section" data-state={ok ? 'ready' : 'error'}>
    <h2>{SIM_SECTIONS[id].title}</h2>
    {children}
  </section>
);

/** A section shown as a page of its own: the way back to the sheet, the caution, the section. */
export const SimSectionPage: FC<{ candidateId: string; sheetHref: string; children?: Child }> = ({
  candidateId,
  sheetHref,
  children,
}) => (
  <article class="candidate-sheet">
    <p class="crumbs">
      <a href={sheetHref}>← Candidate sheet of {candidateId}</a>
    </p>
    <h1>{candidateId}</h1>
    <SafetyNote />
    {children}
  </article>
);
