// The workshop cautions, shown where a cut is planned: one calm line, with the fuller note a
// click away (for timber or for metal), or a short list given by the library for the piece at hand
// (e.g. a chime set's metal cautions). Never a pop-up, never repeated in the way.
import { LitElement, html, css } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { sharedStyles } from '../styles/sharedStyles.ts';

/** `<bw-cautions>` or `<bw-cautions .items>` */
@customElement('bw-cautions')
export class BwCautions extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        margin: 0.6rem 0;
      }
      .caution {
        background: var(--bw-caution-ground);
        color: var(--bw-caution-ink);
        border-left: 5px solid var(--bw-caution-ink);
        border-radius: 6px;
        padding: 0.5rem 0.8rem;
      }
      summary {
        color: var(--bw-caution-ink);
        min-height: var(--bw-touch);
      }
      ul {
        margin: 0.3rem 0 0.2rem;
        padding-left: 1.2rem;
      }
      li {
        margin-bottom: 0.25rem;
      }
    `,
  ];

  /** The library's cautions for this piece, shown as an open list; absent: the workshop note. */
  @property({ attribute: false }) items: readonly string[] | null = null;
  /** What the piece is made of: the note speaks of dust and restricted timber only for timber. */
  @property() material: 'timber' | 'metal' = 'timber';

  protected override render() {
    if (this.items)
      return html`<div class="caution" role="note" aria-label="Workshop cautions">
        <strong>Before cutting</strong>
        <ul>
          ${this.items.map((caution) => html`<li>${caution}</li>`)}
        </ul>
      </div>`;
    const metal = this.material === 'metal';
    return html`<div class="caution" role="note" aria-label="Workshop cautions">
      <details>
        <summary>${metal ? 'Before cutting: cut less than predicted, guard the tools, deburr. More…' : 'Before cutting: cut less than predicted, guard the tools, extract the dust. More…'}</summary>
        <ul>
          <li><strong>Cut less than predicted.</strong> Predictions are estimates; ${metal ? 'metal' : 'wood'} cannot be put back. Take part of the advised cut, let the bar ${metal ? 'cool' : 'rest'}, strike and measure again.</li>
          <li><strong>Power tools</strong> (band saw, drum or belt sander, grinder, router): keep the guards on, wear eye and hearing protection, keep hands clear of the blade, and follow the tool maker's instructions.</li>
          ${metal
            ? html`<li><strong>Metal work.</strong> Deburr cut edges, handle cutting fluids as their data sheet says, and keep swarf off the floor.</li>`
            : html`<li><strong>Dust.</strong> Fine hardwood dust, tropical species especially, irritates and can sensitise the lungs: use dust extraction and a suitable respirator.</li>
                <li><strong>Restricted timber.</strong> Some tonewood species are trade-restricted (CITES and national rules): check before buying, selling or exporting.</li>`}
          <li><strong>Local rules.</strong> Follow licensed practice and your local codes for workshops and electrical equipment.</li>
        </ul>
      </details>
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-cautions': BwCautions;
  }
}
