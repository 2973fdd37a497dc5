// The always-visible strip: units, the A4 reference, the target ratios, the air temperature and
// the last save time (or why the last save failed).
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { ProjectFile } from '../../src/index.ts';
import type { KeeperState } from '../storage/ProjectKeeper.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatClock, formatRatios } from '../format.ts';

/** `<bw-status-strip .project .keeper register-id>` */
@customElement('bw-status-strip')
export class BwStatusStrip extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      dl {
        display: flex;
        flex-wrap: wrap;
        gap: 0.3rem 1.4rem;
        margin: 0;
        align-items: baseline;
      }
      div {
        display: flex;
        gap: 0.35rem;
        align-items: baseline;
      }
      dt {
        color: var(--bw-ink-muted);
        font-size: 0.85rem;
        white-space: nowrap;
      }
      .nowrap {
        white-space: nowrap;
      }
      dd {
        margin: 0;
        font-weight: 700;
        font-variant-numeric: tabular-nums;
      }
      .saved dd {
        color: var(--bw-in-tune);
      }
      .unsaved dd {
        color: var(--bw-caution-ink);
      }
      .failed dd {
        color: var(--bw-problem-ink);
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: false }) keeper: KeeperState | null = null;
  /** The register whose ratios to show (the open bar's), or empty for all. */
  @property({ attribute: 'register-id' }) registerId = '';

  private saveText(): { kind: string; text: string } {
    const keeper = this.keeper;
    if (!keeper) return { kind: '', text: '–' };
    if (keeper.storageProblem) return { kind: 'failed', text: 'not kept in this browser' };
    if (keeper.saveProblem) return { kind: 'failed', text: 'last change NOT saved' };
    if (keeper.conflict) return { kind: 'failed', text: 'waiting: changed in another tab' };
    if (keeper.saving || keeper.unsaved) return { kind: 'unsaved', text: 'saving…' };
    return { kind: 'saved', text: keeper.lastSavedAt ? `✓ ${formatClock(keeper.lastSavedAt)}` : 'not yet' };
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const registers = project.instrument.registers.filter((register) => !this.registerId || register.id === this.registerId);
    // Registers sharing ratios are listed together: "Bass, Middle 1 : 4 : 10 · Treble 1 : 4".
    const groups = new Map<string, string[]>();
    for (const register of registers) groups.set(formatRatios(register.ratios), [...(groups.get(formatRatios(register.ratios)) ?? []), register.label.split(' (')[0]!]);
    const save = this.saveText();
    return html`<dl aria-label="Reference values">
      <div><dt>A4</dt><dd data-testid="a4">${project.instrument.a4_hz} Hz</dd></div>
      <div>
        <dt>Target ratios</dt>
        <dd>${[...groups.entries()].map(([ratios, names], index) => html`${index > 0 ? ' · ' : ''}${registers.length > 1 ? html`<span class="muted">${names.join(', ')}</span> ` : ''}<span class="nowrap">${ratios}</span>`)}</dd>
      </div>
      <div><dt>Air</dt><dd>${project.instrument.air_temperature_c} °C</dd></div>
      <div><dt>Units</dt><dd>mm · Hz · cents</dd></div>
      <div class=${save.kind} role="status" aria-live="polite"><dt>Saved</dt><dd data-testid="save-status">${save.text}</dd></div>
    </dl>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-status-strip': BwStatusStrip;
  }
}
