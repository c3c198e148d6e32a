import { useTrainer } from './context';

// Where the learner's work is: on the server, on its way, or only on this device for now.

const timeOf = (iso: string | null) => {
  if (!iso) return '';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '' : date.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
};

export function SaveStatus() {
  const { status, savedAt } = useTrainer((s) => s.save);
  const time = timeOf(savedAt);
  const [icon, words, tone] =
    status === 'saved' ? ['✓', time ? `Saved ${time}` : 'Saved', 'text-go-700']
    : status === 'saving' ? ['', 'Saving…', 'text-steel-600']
    : status === 'offline' ? ['⚠', 'Offline: kept on this device, retrying', 'text-signal-700']
    : ['', 'Your work saves as you go', 'text-steel-500'];
  return (
    <p className={`flex items-center gap-1 text-sm font-semibold ${tone}`} data-save-status={status}>
      {icon && <span aria-hidden="true">{icon}</span>}
      {words}
    </p>
  );
}
