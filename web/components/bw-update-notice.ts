// A calm line under the header when a new version of the workbench is ready: "Reload to update"
// stores every change first (SaveBeforeUpdateEvent, answered by the app shell) and only then
// switches; if a change cannot be stored, it says so and waits. Shows nothing otherwise.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { SaveBeforeUpdateEvent, appUpdates, type AppUpdateState } from '../offline/appUpdates.ts';

/** `<bw-update-notice>` */
@customElement('bw-update-notice')
export class BwUpdateNotice extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .notice {
        margin: 0.6rem 1.2rem 0;
        padding: 0.7rem 1rem;
        border-radius: 8px;
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem;
        align-items: center;
        background: var(--bw-action-soft);
        color: var(--bw-ink);
      }
      .problem {
        color: var(--bw-problem-ink);
      }
      /* Not printed, and not in the flow of a print (a named-page view would start with a blank page). */
      @media print {
        :host {
          display: none;
        }
      }
    `,
  ];

  @state() private versions: AppUpdateState = appUpdates.state;
  @state() private busy = false;
  @state() private unsaved = false;
  private unsubscribe: (() => void) | null = null;

  override connectedCallback(): void {
    super.connectedCallback();
    this.unsubscribe = appUpdates.subscribe((versions) => (this.versions = versions));
    this.versions = appUpdates.state;
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.unsubscribe?.();
    this.unsubscribe = null;
  }

  private async reload(): Promise<void> {
    this.busy = true;
    this.unsaved = false;
    const request = new SaveBeforeUpdateEvent();
    this.dispatchEvent(request);
    const saved = await (request.saved ?? Promise.resolve(true));
    if (!saved) {
      this.busy = false;
      this.unsaved = true;
      return;
    }
    appUpdates.reloadIntoNewVersion();
  }

  protected override render() {
    const { waiting, activeElsewhere } = this.versions;
    if (!waiting && !activeElsewhere) return nothing;
    return html`<div class="notice" role="status" data-testid="update-notice">
      <span>${waiting ? 'A new version of the workbench is ready.' : 'The workbench was updated in another tab.'} Your work is kept: every change is saved before the page reloads.</span>
      <button class="primary" ?disabled=${this.busy} @click=${() => void this.reload()} data-testid="update-reload">Reload to update</button>
      ${this.unsaved ? html`<span class="problem" role="alert">A change could not be saved yet (see the message above), so the page was not reloaded. Sort that out or export the project, then try again.</span>` : nothing}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-update-notice': BwUpdateNotice;
  }
}
