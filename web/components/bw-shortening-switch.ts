// The switch that lets the next-cut advice shorten a bar (`limits.allow_shortening` of its
// session): a flat bar can only be raised by shortening it, which costs length, so it is the
// maker's choice. Shown beside the advice of undercut bars; tubes and rods are always shortened.
import { LitElement, html, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { setAllowShortening, type ProjectBar } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { checkSwitchStyles } from '../styles/checkSwitchStyles.ts';
import { sendEdit } from '../events.ts';

/** `<bw-shortening-switch .bar>` */
@customElement('bw-shortening-switch')
export class BwShorteningSwitch extends LitElement {
  static override styles = [sharedStyles, checkSwitchStyles];

  @property({ attribute: false }) bar: ProjectBar | null = null;
  @state() private error = '';

  private toggle(event: Event): void {
    const bar = this.bar;
    if (!bar) return;
    const allow = (event.target as HTMLInputElement).checked;
    const outcome = sendEdit(this, (project) => setAllowShortening(project, bar.id, allow, new Date().toISOString()));
    this.error = outcome.ok ? '' : outcome.error.message;
  }

  protected override render() {
    const bar = this.bar;
    if (!bar) return nothing;
    return html`<label title="A flat bar can only be raised by shortening it (both ends equally): every partial rises, and the length is gone for good.">
        <input type="checkbox" name="allow-shortening" data-testid="allow-shortening" .checked=${bar.session.limits.allow_shortening === true} @change=${this.toggle} />
        Advice may shorten the bar
      </label>
      ${this.error ? html`<p class="problem" role="alert">${this.error}</p>` : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-shortening-switch': BwShorteningSwitch;
  }
}
