// Styles shared by the workbench's elements (each element adopts them in its shadow root).
import { css } from 'lit';

/** Buttons, inputs, panels, focus rings and the sharp/flat/in-tune marks. */
export const sharedStyles = css`
  :host {
    box-sizing: border-box;
    font-family: var(--bw-font);
    color: var(--bw-ink);
  }
  *,
  *::before,
  *::after {
    box-sizing: inherit;
  }
  h2,
  h3,
  h4 {
    margin: 0 0 0.5rem;
    line-height: 1.2;
  }
  h2 {
    font-size: 1.35rem;
  }
  h3 {
    font-size: 1.1rem;
  }
  p {
    margin: 0 0 0.5rem;
  }
  .panel {
    background: var(--bw-panel);
    border: 1px solid var(--bw-line-soft);
    border-radius: 10px;
    padding: 1rem;
  }
  button,
  .button {
    font: inherit;
    min-height: var(--bw-touch);
    min-width: var(--bw-touch);
    padding: 0.5rem 1rem;
    border-radius: 8px;
    border: 2px solid var(--bw-action);
    background: var(--bw-panel);
    color: var(--bw-action);
    font-weight: 600;
    cursor: pointer;
    display: inline-flex;
    align-items: center;
    justify-content: center;
    gap: 0.4rem;
    text-decoration: none;
  }
  button.primary,
  .button.primary {
    background: var(--bw-action);
    color: var(--bw-action-ink);
  }
  button:disabled {
    border-color: var(--bw-line);
    color: var(--bw-ink-muted);
    background: var(--bw-line-soft);
    cursor: not-allowed;
  }
  button:focus-visible,
  .button:focus-visible,
  input:focus-visible,
  select:focus-visible,
  textarea:focus-visible,
  summary:focus-visible,
  a:focus-visible,
  [tabindex]:focus-visible {
    outline: 3px solid var(--bw-focus);
    outline-offset: 2px;
  }
  input,
  select,
  textarea {
    font: inherit;
    min-height: var(--bw-touch);
    padding: 0.4rem 0.6rem;
    border: 1.5px solid var(--bw-ink-muted);
    border-radius: 6px;
    background: #ffffff;
    color: var(--bw-ink);
  }
  input[aria-invalid='true'] {
    border-color: var(--bw-problem-ink);
    border-width: 2px;
  }
  label {
    font-weight: 600;
  }
  a {
    color: var(--bw-action);
  }
  table {
    border-collapse: collapse;
    font-variant-numeric: tabular-nums;
  }
  th,
  td {
    padding: 0.35rem 0.6rem;
    text-align: left;
    border-bottom: 1px solid var(--bw-line-soft);
    vertical-align: middle;
  }
  th {
    font-size: 0.85rem;
    color: var(--bw-ink-muted);
    font-weight: 700;
  }
  td.number,
  th.number {
    text-align: right;
  }
  /* A wide table scrolls inside its box instead of widening the page (tablet portrait); soft
     shadows at the box's edges show that more columns lie beyond (they move with the scroll). */
  .table-wrap {
    overflow-x: auto;
    max-width: 100%;
    background:
      linear-gradient(to right, var(--bw-panel) 30%, rgb(255 255 255 / 0)) left / 2rem 100% no-repeat local,
      linear-gradient(to left, var(--bw-panel) 30%, rgb(255 255 255 / 0)) right / 2rem 100% no-repeat local,
      radial-gradient(farthest-side at 0 50%, rgb(0 0 0 / 0.2), transparent) left / 0.7rem 100% no-repeat scroll,
      radial-gradient(farthest-side at 100% 50%, rgb(0 0 0 / 0.2), transparent) right / 0.7rem 100% no-repeat scroll;
  }
  /* The note name leads each row of a per-bar or per-chime table: readable from the bench. */
  td.note {
    font-size: 1.25rem;
    font-weight: 800;
  }
  .muted {
    color: var(--bw-ink-muted);
  }
  .sharp {
    color: var(--bw-sharp);
  }
  .flat {
    color: var(--bw-flat);
  }
  .in-tune {
    color: var(--bw-in-tune);
  }
  .problem {
    background: var(--bw-problem-ground);
    color: var(--bw-problem-ink);
    border-radius: 8px;
    padding: 0.6rem 0.8rem;
  }
  .unavailable {
    border: 2px dashed var(--bw-line);
    border-radius: 8px;
    padding: 0.8rem;
    color: var(--bw-ink-muted);
    background: var(--bw-paper);
  }
  details > summary {
    cursor: pointer;
    min-height: var(--bw-touch);
    display: flex;
    align-items: center;
    font-weight: 600;
    color: var(--bw-action);
  }
  .visually-hidden {
    position: absolute;
    width: 1px;
    height: 1px;
    overflow: hidden;
    clip: rect(0 0 0 0);
    white-space: nowrap;
  }
  .row {
    display: flex;
    flex-wrap: wrap;
    gap: 0.6rem;
    align-items: center;
  }
`;
