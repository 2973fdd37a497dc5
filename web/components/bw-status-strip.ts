// The always-visible strip: units, the A4 reference, the target ratios, the air temperature and
// the last save time (or why the last save failed). On a laptop it is a labelled row; below
// 1100 px wide (a tablet) the same values wrap into two short lines so the header stays one line.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { ProjectFile, Register } from '../../src/index.ts';
import type { KeeperState } from '../storage/ProjectKeeper.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatClock, formatRatios } from '../format.ts';

/** A register's targets in words: "1 : 4 : 10", or "fundamental only" when one partial is tuned (it is not a count). */
function targetWords(register: Register): string {
  return register.ratios.length === 1 ? 'fundamental only' : formatRatios(register.ratios);
}

/** `<bw-status-strip .project .keeper register-id>` */
@customElement('bw-status-strip')
export class BwStatusStrip extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        min-width: 0;
      }
      dl {
        display: flex;
        flex-wrap: wrap;
        gap: 0.2rem 1.2rem;
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
      /* Many registers: their targets stay on one line (all of them in the hover text). */
      .label-short {
        display: none;
      }
      .ratios dd {
        max-width: 26rem;
        overflow: hidden;
        text-overflow: ellipsis;
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
      /* Tablet: the same values in two short lines (the header stays one line). */
      @media (max-width: 1099px) {
        dl {
          gap: 0 0.7rem;
          font-size: 0.8rem;
          line-height: 1.3;
          max-width: 12.5rem;
        }
        dt {
          font-size: 0.75rem;
        }
        .group-names,
        .label-long {
          display: none;
        }
        .label-short {
          display: inline;
        }
        .ratios dd {
          max-width: 7.5rem;
          overflow: hidden;
          text-overflow: ellipsis;
          white-space: nowrap;
        }
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
    // Registers sharing targets are listed together: "Bass, Middle 1 : 4 : 10 · Treble 1 : 4".
    const groups = new Map<string, string[]>();
    for (const register of registers) groups.set(targetWords(register), [...(groups.get(targetWords(register)) ?? []), register.label.split(' (')[0]!]);
    const save = this.saveText();
    const ratiosTitle = [...groups.entries()].map(([targets, names]) => `${names.join(', ')}: ${targets}`).join('; ');
    return html`<dl aria-label="Reference values">
      <div><dt>A4</dt><dd data-testid="a4">${project.instrument.a4_hz} Hz</dd></div>
      <div class="ratios" title=${`Target ratios: ${ratiosTitle}`}>
        <dt><span class="label-long">Target </span>ratios</dt>
        <dd>${[...groups.entries()].map(([targets, names], index) => html`${index > 0 ? ' · ' : ''}${registers.length > 1 ? html`<span class="muted group-names">${names.join(', ')}</span> ` : ''}<span class="nowrap">${targets}</span>`)}</dd>
      </div>
      <div title="The playing temperature: every reading is shown at it and the tubes are sized for it"><dt><span class="label-long">Playing</span><span class="label-short">at</span></dt><dd>${project.instrument.air_temperature_c} °C</dd></div>
      <div><dt class="label-long">Units</dt><dd>mm · Hz · cents</dd></div>
      <div class=${save.kind} role="status" aria-live="polite"><dt>Saved</dt><dd data-testid="save-status">${save.text}</dd></div>
    </dl>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-status-strip': BwStatusStrip;
  }
}
