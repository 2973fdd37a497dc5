// Development page for <bw-listen> on its own: targets from the query string
// (?targets=351.2,1404.9,3512), every partials-measured event kept on window for tests.
import '../components/bw-listen.ts';
import type { PartialsMeasuredDetail } from '../components/bw-listen.ts';

const events: PartialsMeasuredDetail[] = [];
(window as unknown as { listenEvents: PartialsMeasuredDetail[] }).listenEvents = events;

const element = document.querySelector('bw-listen')!;
const targets = new URLSearchParams(location.search).get('targets');
if (targets) element.targetHz = targets.split(',').map(Number).filter((n) => Number.isFinite(n) && n > 0);

const log = document.getElementById('events')!;
document.addEventListener('partials-measured', (event) => {
  const detail = (event as CustomEvent<PartialsMeasuredDetail>).detail;
  events.push(detail);
  log.textContent = JSON.stringify(events, null, 1);
});
