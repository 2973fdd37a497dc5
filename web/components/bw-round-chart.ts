// Partial errors per round in cents: measured (solid) and what was predicted before striking
// (dashed, hollow points), one series per partial with its own point shape, plotted with
// chart.js. Zero is the target.
import { LitElement, html, css } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { seriesStyles } from '../charts/chartSetup.ts';
import { LineChartController } from '../controllers/LineChartController.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { partialName } from '../format.ts';

/** One round's errors (cents per partial; null where none). */
export interface RoundErrors {
  measured: (number | null)[];
  predicted: (number | null)[];
}

/** `<bw-round-chart .rounds>` */
@customElement('bw-round-chart')
export class BwRoundChart extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .frame {
        position: relative;
        height: 280px;
      }
    `,
  ];

  @property({ attribute: false }) rounds: RoundErrors[] = [];
  /** Show only ±zoomCents around the target (early rounds are often hundreds of cents off). */
  @state() private zoomed = false;
  private readonly zoomCents = 60;
  private readonly lineChart = new LineChartController(this);

  protected override render() {
    return html`<div class="row" style="justify-content: flex-end">
        <button aria-pressed=${this.zoomed ? 'true' : 'false'} @click=${() => (this.zoomed = !this.zoomed)}>${this.zoomed ? 'Show all rounds in full' : `Zoom to ±${this.zoomCents} cents`}</button>
      </div>
      <div class="frame"><canvas role="img" aria-label="Cents from target per round, measured and predicted, for each partial"></canvas></div>`;
  }

  protected override updated(): void {
    const canvas = this.renderRoot.querySelector('canvas');
    if (!canvas) return;
    const partials = Math.max(0, ...this.rounds.map((round) => round.measured.length));
    const datasets = Array.from({ length: partials }, (_, index) => {
      const style = seriesStyles[index % seriesStyles.length]!;
      const measured = {
        label: `${partialName(index)} measured`,
        data: this.rounds.map((round, step) => ({ x: step + 1, y: round.measured[index] ?? Number.NaN })).filter((point) => Number.isFinite(point.y)),
        borderColor: style.color,
        backgroundColor: style.color,
        borderWidth: 2.5,
        pointStyle: style.point,
        pointRadius: 6,
      };
      const predicted = {
        label: `${partialName(index)} predicted`,
        data: this.rounds.map((round, step) => ({ x: step + 1, y: round.predicted[index] ?? Number.NaN })).filter((point) => Number.isFinite(point.y)),
        borderColor: style.color,
        backgroundColor: '#ffffff',
        borderDash: [6, 4],
        borderWidth: 1.5,
        pointStyle: style.point,
        pointRadius: 6,
        pointBorderWidth: 2,
      };
      return [measured, predicted];
    }).flat();
    this.lineChart.draw(canvas, datasets, {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      scales: {
        x: { type: 'linear', title: { display: true, text: 'Round' }, ticks: { stepSize: 1, precision: 0 }, min: 0.5, max: Math.max(1.5, this.rounds.length + 0.5) },
        y: { title: { display: true, text: 'Cents from target (+ sharp, − flat)' }, min: this.zoomed ? -this.zoomCents : undefined, max: this.zoomed ? this.zoomCents : undefined },
      },
      plugins: { legend: { labels: { usePointStyle: true } } },
    });
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-round-chart': BwRoundChart;
  }
}
