import { CategoryScale, Chart as ChartJS, Legend, LinearScale, LineController, LineElement, PointElement, Tooltip, type ChartOptions, type PointStyle } from 'chart.js';
import { Line } from 'react-chartjs-2';
import { STAGE_LABELS } from '../trainer/labels';
import type { Stage } from '../../lib/procedure/schema';
import type { ProgressJson } from './types';

// Scores over time for one procedure, a line per stage. Each stage has its own colour, point shape and
// dash, so the lines tell apart without colour; the table beside the chart says the same in words.

ChartJS.register(LineController, LineElement, PointElement, LinearScale, CategoryScale, Tooltip, Legend);

const LOOK: Record<Stage, { color: string; point: PointStyle; dash: number[] }> = {
  order: { color: '#1f4e79', point: 'circle', dash: [] },
  pins: { color: '#b5781d', point: 'rect', dash: [6, 3] },
  pattern: { color: '#2f8a4c', point: 'triangle', dash: [2, 2] },
  wrench: { color: '#8f2a1d', point: 'rectRot', dash: [10, 4, 2, 4] },
  'final-check': { color: '#5b6b7a', point: 'star', dash: [1, 4] },
};

type ProcedureProgress = ProgressJson['procedures'][number];

const dateWords = (ms: number) => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short' }).format(new Date(ms));
const timeWords = (ms: number) => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' }).format(new Date(ms));

const HOUR = 3_600_000;

/** The time axis: from the first attempt to the last, with room either side (half a day at least). */
function timeRange(procedure: ProcedureProgress): { min: number; max: number } {
  const times = procedure.stages.flatMap((s) => s.attempts.map((a) => new Date(a.at).getTime()));
  const first = Math.min(...times);
  const last = Math.max(...times);
  const pad = Math.max(12 * HOUR, (last - first) * 0.05);
  return { min: first - pad, max: last + pad };
}

export function ScoreChart({ procedure }: { procedure: ProcedureProgress }) {
  const range = timeRange(procedure);
  // Within a couple of days the ticks need the hour too.
  const tickWords = range.max - range.min < 3 * 24 * HOUR ? timeWords : dateWords;
  const data = {
    datasets: procedure.stages.map((s) => ({
      label: STAGE_LABELS[s.stage],
      data: s.attempts.map((a) => ({ x: new Date(a.at).getTime(), y: a.percent })),
      borderColor: LOOK[s.stage].color,
      backgroundColor: LOOK[s.stage].color,
      borderDash: LOOK[s.stage].dash,
      pointStyle: LOOK[s.stage].point,
      pointRadius: 5,
      borderWidth: 2,
    })),
  };
  const options: ChartOptions<'line'> = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    parsing: false,
    scales: {
      x: { type: 'linear', min: range.min, max: range.max, ticks: { callback: (value) => tickWords(Number(value)), maxTicksLimit: 6 } },
      y: { min: 0, max: 100, title: { display: true, text: 'Score %' }, ticks: { stepSize: 25 } },
    },
    plugins: {
      legend: { position: 'bottom', labels: { usePointStyle: true } },
      tooltip: { callbacks: { title: (items) => (items[0] ? timeWords(Number(items[0].parsed.x)) : ''), label: (item) => `${item.dataset.label}: ${item.parsed.y} %` } },
    },
  };
  const summary = procedure.stages.map((s) => `${STAGE_LABELS[s.stage]} latest ${s.latest} %`).join(', ');
  return (
    <div className="h-64">
      <Line data={data} options={options} role="img" aria-label={`Scores over time for ${procedure.title}: ${summary}`} />
    </div>
  );
}
