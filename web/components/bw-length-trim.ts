// The next-cut panel of a piece tuned by its length (a chime tube or rod): the trim to make, in
// millimetres off the free end (or half from each end), worked out in the solver worker from the
// last round; the length the maker actually trimmed, recorded as cut; and "done" once a round is
// in tune. No thickness limits: a tube is never undercut.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import {
  barLengthTrimInput,
  barLot,
  recordLotLearning,
  barMaterialFamily,
  barShortenAt,
  recordShortening,
  setBarState,
  setShortenAt,
  stableHash,
  trimRangeMm,
  type LengthTrim,
  type ProjectBar,
  type ProjectFile,
  type ShortenAt,
} from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { formatMm } from '../format.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';
import './bw-cautions.ts';

/** `<bw-length-trim .project .bar>` */
@customElement('bw-length-trim')
export class BwLengthTrim extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .advice-status {
        font-size: 1.25rem;
        font-weight: 800;
      }
      .trim {
        font-size: 2rem;
        font-weight: 800;
        margin: 0.3rem 0;
      }
      .record {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem;
        align-items: end;
        margin-top: 0.8rem;
      }
      .where {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem 1rem;
        border: none;
        padding: 0;
        margin: 0.4rem 0 0.8rem;
      }
      .where label {
        display: inline-flex;
        align-items: center;
        gap: 0.5rem;
        min-height: var(--bw-touch);
      }
      .where input {
        width: var(--bw-touch);
        height: var(--bw-touch);
        margin: 0;
        accent-color: var(--bw-action);
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: false }) bar: ProjectBar | null = null;

  @state() private trimmed: number | null = null;
  @state() private error = '';

  private readonly advice = new TaskController<LengthTrim>(this, { policy: 'latest' });
  private adviceKey = '';

  protected override willUpdate(): void {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return;
    const input = barLengthTrimInput(project, bar);
    if (!input) return;
    const key = stableHash(input);
    if (key === this.adviceKey) return;
    this.adviceKey = key;
    this.trimmed = null;
    this.advice.run({ subject: bar.id, key }, workerJob(solver, 'lengthTrim', input));
  }

  private edit(change: (project: ProjectFile) => ProjectFile): void {
    const outcome = sendEdit(this, change);
    this.error = outcome.ok ? '' : outcome.error.message;
  }

  /**
   * The piece is in tune: marked done. A piece cut from a named lot teaches it what its rounds
   * learnt (the done verdict of the session's next-cut advice carries it), as a bar does.
   */
  private markDone(): void {
    const bar = this.bar!;
    const at = new Date().toISOString();
    const lot = barLot(bar);
    const record = bar.advice?.status === 'done' && bar.advice.from_steps === bar.session.steps.length ? bar.advice.lot_record : undefined;
    this.edit((project) => {
      const marked = setBarState(project, bar.id, 'done', at);
      return lot && record ? recordLotLearning(marked, lot, { ...record, learnt_at: at }) : marked;
    });
  }

  private recordTrim(): void {
    const bar = this.bar!;
    const value = this.trimmed ?? this.advice.state(bar.id).value?.trim_mm ?? null;
    if (value === null) return;
    this.edit((project) => recordShortening(project, bar.id, value, new Date().toISOString()));
  }

  private renderWhere(bar: ProjectBar) {
    const chosen = barShortenAt(bar);
    const option = (value: ShortenAt, label: string) =>
      html`<label><input type="radio" name="shorten-at" value=${value} .checked=${chosen === value} @change=${() => this.edit((project) => setShortenAt(project, bar.id, value, new Date().toISOString()))} />${label}</label>`;
    return html`<fieldset class="where">
      <legend>Trim at</legend>
      ${option('free-end', 'the free end (hung from the other)')} ${option('both-ends', 'both ends, half each (on cords)')}
    </fieldset>`;
  }

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return nothing;
    const heading = html`<h3 id="trim-heading">Next cut: length</h3>`;
    if (bar.state === 'done') return html`<section class="panel" aria-labelledby="trim-heading">${heading}<p class="advice-status in-tune" data-testid="piece-done">● This piece is marked done.</p></section>`;
    if (bar.session.steps.length === 0)
      return html`<section class="panel" aria-labelledby="trim-heading">${heading}<p class="muted">Strike the piece and record a round: a tube or rod is tuned by trimming its length, and the trim comes from what it sounds like.</p>${this.renderWhere(bar)}</section>`;
    const last = bar.session.steps[bar.session.steps.length - 1]!;
    if (last.bar.length_mm !== bar.current.length_mm) {
      const taken = last.bar.length_mm - bar.current.length_mm;
      return html`<section class="panel" aria-labelledby="trim-heading">
        ${heading}
        <p class="advice-status" data-testid="strike-now">Trimmed ${formatMm(taken, 2)} mm (now ${formatMm(bar.current.length_mm, 2)} mm): strike it and record the round.</p>
        <p class="muted">The next advice is worked out from what it sounds like now.</p>
      </section>`;
    }
    const state = this.advice.state(bar.id);
    const advice = state.value;
    if (!advice || state.running) {
      return html`<section class="panel" aria-labelledby="trim-heading">
        ${heading}
        ${state.problem && state.problem.status !== 'stale' ? html`<p class="problem" role="alert">${state.problem.status === 'input-error' ? `${state.problem.field}: ${state.problem.rule}` : state.problem.status === 'failed' ? state.problem.message : 'The advice is not available.'}</p>` : html`<p role="status">Working out the trim…</p>`}
      </section>`;
    }
    const range = trimRangeMm(bar);
    return html`<section class="panel" aria-labelledby="trim-heading" data-testid="length-trim">
      ${heading}
      ${advice.status === 'in-tune'
        ? html`<p class="advice-status in-tune">● In tune: the fundamental is within tolerance. No trim needed.</p>
            ${barLot(bar) && !(bar.advice?.status === 'done' && bar.advice.from_steps === bar.session.steps.length)
              ? html`<p role="status">Working out what this piece teaches its lot…</p>`
              : html`<button class="primary" data-testid="mark-piece-done" @click=${this.markDone}>Mark the piece done</button>`}`
        : advice.status === 'sharp'
          ? html`<p class="advice-status problem">▲ Sharp: trimming cannot lower it.</p><p data-testid="trim-advice">${advice.advice}</p>`
          : html`<p class="advice-status">▼ Flat: raise it by trimming.</p>
              <p class="trim" data-testid="trim-mm">Trim ${formatMm(advice.trim_mm, 1)} mm ${advice.shorten_at === 'free-end' ? 'off the free end' : `in all (${formatMm(advice.trim_mm / 2, 2)} mm each end)`}</p>
              <p data-testid="trim-advice">${advice.advice}</p>
              <p class="muted">About ${formatMm(advice.cents_per_mm, 1)} cents per mm at this length (a uniform tube: ${formatMm(advice.closed_form_cents_per_mm, 1)}, from f ∝ 1/L²).</p>
              ${this.renderWhere(bar)}
              <bw-cautions material=${barMaterialFamily(bar.current)}></bw-cautions>
              <div class="record">
                <bw-number-field label="Length trimmed" unit="mm" name="trimmed-mm" .value=${this.trimmed ?? advice.trim_mm} .min=${range.min} .max=${range.max} hint="What you actually took off: the next round starts from it."
                  @value-commit=${(event: CustomEvent<ValueCommitDetail>) => (this.trimmed = event.detail.value)}></bw-number-field>
                <button class="primary" data-testid="record-trim" @click=${this.recordTrim}>I trimmed it</button>
              </div>`}
      ${this.error ? html`<p class="problem" role="alert">${this.error}</p>` : nothing}
    </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-length-trim': BwLengthTrim;
  }
}
