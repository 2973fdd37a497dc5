// chart.js set-up for the workbench: only the parts used are registered, in the workbench's
// font and ink. Series differ by line dash and point shape as well as colour, so plots read
// without the legend's colours.
import { Chart, LineController, LineElement, PointElement, LinearScale, Legend, Tooltip, Filler, BarController, BarElement, CategoryScale, Title } from 'chart.js';

Chart.register(LineController, LineElement, PointElement, LinearScale, Legend, Tooltip, Filler, BarController, BarElement, CategoryScale, Title);
Chart.defaults.font.family = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', 'Liberation Sans', sans-serif";
Chart.defaults.font.size = 14;
Chart.defaults.color = '#1b1e22';
Chart.defaults.animation = false;

/** Per-partial series styles: colour, dash and point shape (colour-blind-safe set). */
export const seriesStyles = [
  { color: '#1b1e22', dash: [] as number[], point: 'circle' as const },
  { color: '#9b3a12', dash: [8, 4], point: 'triangle' as const },
  { color: '#24509a', dash: [2, 3], point: 'rect' as const },
  { color: '#2d6a2e', dash: [12, 3, 2, 3], point: 'rectRot' as const },
  { color: '#6a3d8a', dash: [4, 4], point: 'star' as const },
];

export { Chart };
