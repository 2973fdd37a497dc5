// The where-to-cut map: along the bar, how many cents each partial moves when 0.1 mm of depth is
// taken off a 10 mm strip there (below zero lowers the partial, above zero raises it), from the
// library's whereToCutMap. Not shown for tubes and rods, which are not undercut.
import { LitElement, html, css } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { seriesStyles } from '../charts/chartSetup.ts';
import { LineChartController } from '../controllers/LineChartController.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { partialName } from '../format.ts';
import type { CutEffectMap } from '../../src/index.ts';

/** `<bw-cut-map .sensitivities applicable length>` */
@customElement('bw-cut-map')
export class BwCutMap extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .frame {
        position: relative;
        height: 240px;
      }
    `,
  ];

  @property({ attribute: false }) sensitivities: CutEffectMap | null = null;
  /** False for sections that are not undercut (tubes, rods): a short note instead of the map. Bind it as a property (`.applicable`): the attribute's absence leaves the default. */
  @property({ type: Boolean }) applicable = true;
  /** Bar length, mm (the x axis ends there). */
  @property({ type: Number, attribute: 'length' }) lengthMm: number | null = null;
  private readonly lineChart = new LineChartController(this);

  protected override render() {
    if (!this.applicable)
      return html`<p class="muted" data-testid="cut-map-length-only">A tube or rod is never undercut: its only cut is its length. Trimming raises every partial together; the Tuning tab says how many millimetres to take off the free end.</p>`;
    if (!this.sensitivities) return html`<p class="muted" role="status">Working out the map…</p>`;
    return html`<p class="muted">Cents each partial moves when ${this.sensitivities.depth_mm} mm of depth comes off a ${this.sensitivities.strip_mm} mm strip at that place: below zero lowers it, above zero raises it. Shortening raises all.</p>
      <div class="frame"><canvas role="img" aria-label="Where-to-cut map: cents per 0.1 mm removed at each place, per partial"></canvas></div>`;
  }

  protected override updated(): void {
    const canvas = this.renderRoot.querySelector('canvas');
    if (!canvas || !this.sensitivities) {
      this.lineChart.draw(null, [], {});
      return;
    }
    const map = this.sensitivities;
    const datasets = map.partials.map((partial, index) => {
      const style = seriesStyles[index % seriesStyles.length]!;
      return {
        label: partialName(index),
        data: map.positions_mm.map((x, i) => ({ x, y: partial.cents[i]! })),
        borderColor: style.color,
        backgroundColor: style.color,
        borderDash: style.dash,
        borderWidth: 2,
        pointStyle: style.point,
        pointRadius: 0,
        pointHitRadius: 6,
      };
    });
    this.lineChart.draw(canvas, datasets, {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      scales: {
        x: { type: 'linear', min: 0, max: this.lengthMm || undefined, title: { display: true, text: 'Position from the left end (mm)' } },
        y: { title: { display: true, text: `Cents per ${map.depth_mm} mm of depth` } },
      },
      plugins: { legend: { labels: { usePointStyle: true } } },
    });
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-cut-map': BwCutMap;
  }
}

