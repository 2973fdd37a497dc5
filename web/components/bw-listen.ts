// Hears the struck bar: listens on the microphone for a strike (or takes a dropped WAV file),
// finds its partials off the main thread, shows each one large with its signed cents from the
// target, sharp/flat in words, and plays reference tones to tune by beats.
import { LitElement, css, html, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { labelPartials, matchTargets, sharpOrFlat, type ExpectedModes, type TapPartial, type TapReport } from '../../src/index.ts';
import { PartialClient } from '../audio/PartialClient.ts';
import type { PartialRequest } from '../audio/partialProtocol.ts';
import { TaskController, type TaskBinding, type TaskProblem } from '../controllers/TaskController.ts';
import { ReferenceTones } from '../audio/ReferenceTones.ts';
import { CaptureError, StrikeCapture } from '../audio/StrikeCapture.ts';
import type { StrikeDetectorState } from '../audio/strikeDetector.ts';
import { formatCents, formatHz, formatNumber, partialName, verdictClass, verdictMark } from '../format.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';

/** Detail of the `partials-measured` event. */
export interface PartialsMeasuredDetail {
  partials: { hz: number; level_db: number; decay_s: number }[];
  source: 'microphone' | 'file';
}

type Status = 'idle' | 'starting' | 'warming-up' | 'waiting' | 'capturing' | 'analysing' | 'denied' | 'unavailable' | 'problem';
type Playing = 'targets' | 'heard' | 'both' | null;

/** One partial as shown: what it is, and how it stands against its target. */
interface ShownPartial {
  partial: TapPartial;
  name: string;
  targetHz: number | null;
  cents: number | null;
  beats: number | null;
  verdict: 'sharp' | 'flat' | 'in tune' | null;
}

/**
 * `<bw-listen>`: properties `targetHz` (Hz, fundamental first; optional), `expected` (predicted
 * modes for labelling; optional), `toleranceCents` (per target, for "in tune"), `a4Hz`,
 * `maxPartials`. Fires `partials-measured` (bubbles, composed) after each analysis.
 */
@customElement('bw-listen')
export class BwListen extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .controls {
        display: flex;
        flex-wrap: wrap;
        gap: 0.75rem;
        align-items: center;
        margin-bottom: 0.75rem;
      }
      .status {
        font-size: 1.1rem;
        font-weight: 600;
      }
      .drop {
        border: 3px dashed var(--bw-line);
        border-radius: 12px;
        padding: 1rem;
        text-align: center;
        margin-bottom: 0.75rem;
      }
      .drop.over {
        border-color: var(--bw-action);
        background: var(--bw-action-soft);
      }
      .fallback {
        background: var(--bw-problem-ground);
        color: var(--bw-problem-ink);
        border-radius: 8px;
        padding: 0.75rem 1rem;
        margin-bottom: 0.75rem;
      }
      .partials {
        display: grid;
        grid-template-columns: repeat(auto-fill, minmax(15rem, 1fr));
        gap: 0.75rem;
        margin: 0.75rem 0;
      }
      .partial {
        border: 2px solid var(--bw-line-soft);
        border-radius: 10px;
        padding: 0.6rem 0.8rem;
        background: var(--bw-panel);
      }
      .partial.sharp {
        border-color: var(--bw-sharp);
      }
      .partial.flat {
        border-color: var(--bw-flat);
      }
      .partial.in-tune {
        border-color: var(--bw-in-tune);
      }
      .name {
        font-weight: 700;
        color: var(--bw-ink-muted);
      }
      .hz {
        font-size: 2.4rem;
        font-weight: 800;
        font-variant-numeric: tabular-nums;
        line-height: 1.1;
      }
      .cents {
        font-size: 2.9rem;
        font-weight: 800;
        font-variant-numeric: tabular-nums;
        line-height: 1.05;
      }
      .verdict {
        font-size: 1.35rem;
        font-weight: 800;
        text-transform: uppercase;
        letter-spacing: 0.04em;
      }
      .sharp .verdict {
        color: var(--bw-sharp);
      }
      .flat .verdict {
        color: var(--bw-flat);
      }
      .in-tune .verdict {
        color: var(--bw-in-tune);
      }
      .unit {
        font-size: 1rem;
        font-weight: 600;
        margin-left: 0.25rem;
      }
      .detail {
        font-size: 0.9rem;
        color: var(--bw-ink-muted);
        font-variant-numeric: tabular-nums;
      }
      .tones {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: center;
      }
      .beats {
        font-size: 1.1rem;
        font-weight: 700;
        font-variant-numeric: tabular-nums;
      }
      .visually-hidden {
        position: absolute;
        width: 1px;
        height: 1px;
        overflow: hidden;
        clip: rect(0 0 0 0);
        white-space: nowrap;
      }
    `,
  ];

  /** Target partials, Hz (fundamental first). */
  @property({ attribute: false }) targetHz: number[] = [];
  /** Predicted modes to label the partials with (e.g. from analyzeBar), or null. */
  @property({ attribute: false }) expected: ExpectedModes | null = null;
  /** "In tune" window per target, cents (common practice: ±2, ±5, ±15). */
  @property({ attribute: false }) toleranceCents: number[] = [2, 5, 15];
  /** Reference pitch for note names, Hz. */
  @property({ type: Number, attribute: 'a4-hz' }) a4Hz = 440;
  /** How many partials to report. */
  @property({ type: Number, attribute: 'max-partials' }) maxPartials = 8;

  @state() private status: Status = 'idle';
  @state() private message = '';
  @state() private report: TapReport | null = null;
  @state() private source: 'microphone' | 'file' | null = null;
  @state() private playing: Playing = null;
  @state() private levelDb: number | null = null;
  @state() private dragOver = false;

  private readonly capture = new StrikeCapture();
  private readonly client = new PartialClient();
  /** The newest strike or file is analysed; a new one replaces an analysis still running. */
  private readonly analysis = new TaskController<TapReport>(this, { onResult: (report, binding) => this.onReport(report, binding), onProblem: (problem) => this.onProblem(problem) });
  private readings = 0;
  private readonly tones = new ReferenceTones();

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    void this.capture.stop();
    void this.tones.dispose();
    this.client.dispose();
  }

  /** True while the microphone is open. */
  get listening(): boolean {
    return this.capture.active;
  }

  private async toggleListening(): Promise<void> {
    if (this.capture.active) {
      await this.capture.stop();
      this.status = 'idle';
      this.levelDb = null;
      return;
    }
    this.status = 'starting';
    this.message = '';
    try {
      await this.capture.start({
        onState: (detector: StrikeDetectorState) => {
          if (this.status !== 'analysing') this.status = detector;
        },
        onLevel: (peakDb) => {
          this.levelDb = peakDb;
        },
        onStrike: (strike) => {
          this.status = 'analysing';
          this.analyse({ kind: 'samples', samples: strike.samples, sampleRate: strike.sampleRate }, 'microphone');
        },
      });
    } catch (error) {
      await this.capture.stop();
      if (error instanceof CaptureError && error.problem === 'denied') this.status = 'denied';
      else this.status = error instanceof CaptureError && error.problem !== 'failed' ? 'unavailable' : 'problem';
      this.message = error instanceof Error ? error.message : String(error);
    }
  }

  /** Analyses a capture or a file in the worker (the key records where it came from). */
  private analyse(request: PartialRequest, source: 'microphone' | 'file'): void {
    this.readings += 1;
    const full: PartialRequest = { ...request, maxPartials: this.maxPartials, ...(this.expected ? { expected: this.expected } : {}) };
    this.analysis.run({ subject: 'reading', key: `${source}:${this.readings}` }, ({ signal }) => this.client.analyse(full, { signal }));
  }

  private onReport(report: TapReport, binding: TaskBinding): void {
    const source = binding.key.startsWith('file:') ? 'file' : 'microphone';
    this.report = report;
    this.source = source;
    this.message = '';
    this.status = this.capture.active ? 'waiting' : 'idle';
    const detail: PartialsMeasuredDetail = {
      partials: report.partials.map(({ hz, level_db, decay_s }) => ({ hz, level_db, decay_s })),
      source,
    };
    this.dispatchEvent(new CustomEvent<PartialsMeasuredDetail>('partials-measured', { detail, bubbles: true, composed: true }));
  }

  private onProblem(problem: TaskProblem): void {
    this.status = this.capture.active ? 'waiting' : 'problem';
    this.message = problem.status === 'unavailable' ? `${problem.what} is not available yet.` : 'message' in problem ? problem.message : 'The analysis was stopped.';
  }

  private async takeFile(file: File | undefined): Promise<void> {
    if (!file) return;
    if (!/\.wav$/i.test(file.name) && !/wav/i.test(file.type)) {
      this.status = 'problem';
      this.message = `${file.name}: file: not a WAV recording (drop a .wav file)`;
      return;
    }
    this.status = 'analysing';
    this.message = '';
    this.analyse({ kind: 'wav', bytes: await file.arrayBuffer(), name: file.name }, 'file');
  }

  private onDrop(event: DragEvent): void {
    event.preventDefault();
    this.dragOver = false;
    void this.takeFile(event.dataTransfer?.files?.[0]);
  }

  private onDragOver(event: DragEvent): void {
    event.preventDefault();
    if (event.dataTransfer) event.dataTransfer.dropEffect = 'copy';
    this.dragOver = true;
  }

  private onFileChosen(event: Event): void {
    const input = event.target as HTMLInputElement;
    void this.takeFile(input.files?.[0]);
    input.value = '';
  }

  /** The partials as shown: targets first in order, then the rest by frequency. */
  private shownPartials(): ShownPartial[] {
    const partials = this.report?.partials ?? [];
    const hz = partials.map((p) => p.hz);
    const labels = this.expected ? labelPartials(hz, this.expected) : null;
    const modes = partials.map((p, i) => p.mode ?? labels?.[i]?.mode ?? null);
    const matches = matchTargets(hz, this.targetHz, this.expected ? { modes } : {});
    const byPartial = new Map(matches.filter((m) => m.partial !== null).map((m) => [m.partial!, m]));
    const shown = partials.map((partial, index): ShownPartial => {
      const match = byPartial.get(index);
      const mode = modes[index];
      const other = partial.other_mode ?? labels?.[index]?.otherMode ?? null;
      const name = match ? partialName(match.target) : mode ? partialName(mode - 1) : (other ?? 'Other');
      const tolerance = match ? (this.toleranceCents[match.target] ?? this.toleranceCents.at(-1) ?? 0) : 0;
      return {
        partial,
        name,
        targetHz: match ? this.targetHz[match.target]! : null,
        cents: match?.cents ?? null,
        beats: match?.beatsPerSecond ?? null,
        verdict: match?.cents !== null && match?.cents !== undefined ? sharpOrFlat(match.cents, tolerance) : null,
      };
    });
    const order = (s: ShownPartial) => (s.targetHz !== null ? this.targetHz.indexOf(s.targetHz) : this.targetHz.length + s.partial.hz / 1e6);
    return shown.sort((a, b) => order(a) - order(b));
  }

  private async play(which: Exclude<Playing, null>): Promise<void> {
    const heard = this.shownPartials()
      .filter((s) => s.targetHz !== null || this.targetHz.length === 0)
      .map((s) => s.partial.hz);
    const frequencies = which === 'targets' ? this.targetHz : which === 'heard' ? heard : [...this.targetHz, ...heard];
    try {
      await this.tones.play(frequencies);
      this.playing = which;
    } catch (error) {
      this.playing = null;
      this.message = `reference tones could not play (${error instanceof Error ? error.message : String(error)})`;
    }
  }

  private stopTones(): void {
    this.tones.stop();
    this.playing = null;
  }

  private statusText(): string {
    switch (this.status) {
      case 'starting':
        return 'Opening the microphone…';
      case 'warming-up':
        return 'Listening to the room…';
      case 'waiting':
        return 'Listening — strike the bar.';
      case 'capturing':
        return 'Strike heard — recording until it dies away…';
      case 'analysing':
        return 'Reading the partials…';
      case 'denied':
      case 'unavailable':
      case 'problem':
        return '';
      default:
        return this.report ? `Partials from the ${this.source === 'microphone' ? 'microphone' : 'recording'}.` : 'Press Listen and strike the bar, or drop a recording.';
    }
  }

  override render() {
    const shown = this.shownPartials();
    const matched = shown.filter((s) => s.beats !== null);
    return html`
      <section class="panel" aria-label="Listen to the bar">
        <h3>Listen to the bar</h3>
        <div class="controls">
          <button class="primary" data-action="listen" aria-pressed=${this.capture.active ? 'true' : 'false'} @click=${() => this.toggleListening()}>
            ${this.capture.active ? 'Stop listening' : 'Listen'}
          </button>
          <span class="status" role="status" aria-live="polite">${this.statusText()}</span>
          ${this.levelDb !== null ? html`<span class="detail">input peak ${formatNumber(Math.max(-99, this.levelDb), 0)} dBFS</span>` : nothing}
        </div>
        ${this.status === 'denied' || this.status === 'unavailable'
          ? html`<div class="fallback" role="alert" data-part="microphone-fallback">
              <strong>No microphone:</strong> ${this.message}. ${this.status === 'denied'
                ? 'Allow the microphone for this page in the browser\u2019s site settings and press Listen again, '
                : ''}or record the strike with any recorder and drop the WAV file below.
            </div>`
          : nothing}
        ${this.status === 'problem' && this.message ? html`<div class="fallback" role="alert" data-part="problem">${this.message}</div>` : nothing}
        <div
          class="drop ${this.dragOver ? 'over' : ''}"
          data-part="drop-zone"
          @dragover=${this.onDragOver}
          @dragleave=${() => (this.dragOver = false)}
          @drop=${this.onDrop}
        >
          <p>Drop a WAV recording of the strike here</p>
          <label class="button" for="wav-file">Choose a WAV file…</label>
          <input id="wav-file" class="visually-hidden" type="file" accept=".wav,audio/wav,audio/x-wav,audio/wave" @change=${this.onFileChosen} />
        </div>
        ${shown.length > 0
          ? html`<div class="partials" data-part="partials">${shown.map((s) => this.renderPartial(s))}</div>`
          : this.report
            ? html`<p data-part="no-partials">No partials found: strike harder or hold the microphone closer.</p>`
            : nothing}
        <div class="tones" data-part="tones">
          <button ?disabled=${this.targetHz.length === 0} @click=${() => this.play('targets')} aria-pressed=${this.playing === 'targets' ? 'true' : 'false'}>Play targets</button>
          <button ?disabled=${shown.length === 0} @click=${() => this.play('heard')} aria-pressed=${this.playing === 'heard' ? 'true' : 'false'}>Play heard</button>
          <button ?disabled=${matched.length === 0} @click=${() => this.play('both')} aria-pressed=${this.playing === 'both' ? 'true' : 'false'}>Play both (beats)</button>
          <button ?disabled=${this.playing === null} @click=${() => this.stopTones()}>Stop tones</button>
        </div>
        ${matched.length > 0
          ? html`<p class="beats" data-part="beats">
              Beats against the targets: ${matched.map((s, i) => html`${i > 0 ? ' · ' : ''}${s.name} ${formatNumber(s.beats, s.beats! < 10 ? 1 : 0)} per second`)}
            </p>`
          : nothing}
      </section>
    `;
  }

  private renderPartial(s: ShownPartial) {
    return html`
      <div class="partial ${verdictClass(s.verdict)}" data-part="partial" data-hz=${String(s.partial.hz)}>
        <div class="name">${s.name}</div>
        <div class="hz">${formatHz(s.partial.hz)}<span class="unit">Hz</span></div>
        ${s.cents !== null
          ? html`<div class="cents" data-part="cents">${formatCents(s.cents)}<span class="unit">cents</span></div>
              <div class="verdict" data-part="verdict">${verdictMark(s.verdict)} ${s.verdict}</div>
              <div class="detail">target ${formatHz(s.targetHz)} Hz · ${formatNumber(s.beats, 1)} beats per second</div>`
          : nothing}
        <div class="detail">level ${formatNumber(s.partial.level_db, 1)} dB · rings ${formatNumber(s.partial.decay_s, 2)} s (to −60 dB)</div>
      </div>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-listen': BwListen;
  }
}
