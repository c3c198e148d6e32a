import type { SaveState } from './useAutosave';

// Where the draft is: saved on the server, on its way, or not saved yet and why.
export function SaveIndicator({ state }: { state: SaveState }) {
  const time = state.status === 'saved' ? new Date(state.at).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' }) : '';
  const [icon, words, tone] =
    state.status === 'saved' ? ['✓', `Draft saved ${time}`, 'text-go-700']
    : state.status === 'saving' ? ['', 'Saving…', 'text-steel-600']
    : state.status === 'pending' ? ['', 'Unsaved changes…', 'text-steel-600']
    : state.status === 'failed' ? ['⚠', `Not saved yet (${state.message}); retrying`, 'text-signal-700']
    : state.status === 'conflict' ? ['⚠', 'Saved from another window: reload to continue with the newer copy', 'text-signal-700']
    : ['', 'Changes save as you go', 'text-steel-500'];
  return (
    <p className={`flex items-center gap-1 text-sm font-semibold ${tone}`} data-save-status={state.status} role="status">
      {icon && <span aria-hidden="true">{icon}</span>}
      {words}
    </p>
  );
}
