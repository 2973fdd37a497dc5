// The switch between next-cut advice on the line model and on the 3D model (slower, closer to the
// real block of wood on a deep arch). Remembered in this browser; fires `advice-theory-change`.
import { LitElement, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { checkSwitchStyles } from '../styles/checkSwitchStyles.ts';
import { rememberAdviceTheory, type AdviceTheory } from '../adviceTheory.ts';

/** `<bw-advice-theory theory="line|solid">` */
@customElement('bw-advice-theory')
export class BwAdviceTheory extends LitElement {
  static override styles = [sharedStyles, checkSwitchStyles];

  @property() theory: AdviceTheory = 'line';

  private toggle(event: Event): void {
    const theory: AdviceTheory = (event.target as HTMLInputElement).checked ? 'solid' : 'line';
    rememberAdviceTheory(theory);
    this.dispatchEvent(new CustomEvent<AdviceTheory>('advice-theory-change', { detail: theory, bubbles: true, composed: true }));
  }

  protected override render() {
    return html`<label title="The 3D model of the bar fits the wood to your readings and, once every partial is within 50 cents, plans each cut as the 3D bar moves: closer to the real bar on a deep arch, about 20 seconds a round instead of a moment (a minute or more when a twisting mode puts the grain at an angle).">
      <input type="checkbox" name="advice-theory" data-testid="advice-solid" .checked=${this.theory === 'solid'} @change=${this.toggle} />
      Advise on the 3D model (slower)
    </label>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-advice-theory': BwAdviceTheory;
  }
}
