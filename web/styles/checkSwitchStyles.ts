import { css } from 'lit';

/** A labelled checkbox as big as a fingertip (ui-notes.md: touch targets ≥ 44 px): the label and its box in one row. */
export const checkSwitchStyles = css`
  :host {
    display: block;
  }
  label {
    display: inline-flex;
    align-items: center;
    gap: 0.5rem;
    min-height: var(--bw-touch);
  }
  input {
    width: var(--bw-touch);
    height: var(--bw-touch);
    margin: 0;
    accent-color: var(--bw-action);
  }
`;
