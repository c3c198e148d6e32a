import { useState, type KeyboardEvent } from 'react';
import type { ClassResults as Results } from '../../lib/results/class-results';
import ResultsTable from './ResultsTable';
import StepAnalysis from './StepAnalysis';

// The results page's island: the learners' table and the step analysis, as two tabs.

const TABS = [
  { id: 'learners', label: 'Learners' },
  { id: 'steps', label: 'Step analysis' },
] as const;
type Tab = (typeof TABS)[number]['id'];

export default function ClassResults({ results }: { results: Results }) {
  const [tab, setTab] = useState<Tab>('learners');

  const onKeyDown = (event: KeyboardEvent<HTMLButtonElement>, index: number) => {
    const next = event.key === 'ArrowRight' || event.key === 'ArrowLeft' ? (index + 1) % TABS.length : null;
    if (next === null) return;
    event.preventDefault();
    setTab(TABS[next]!.id);
    document.getElementById(`results-tab-${TABS[next]!.id}`)?.focus();
  };

  return (
    <div>
      <div role="tablist" aria-label="Class results" className="mb-4 flex gap-2">
        {TABS.map((t, index) => (
          <button
            key={t.id}
            id={`results-tab-${t.id}`}
            type="button"
            role="tab"
            aria-selected={tab === t.id}
            aria-controls={`results-panel-${t.id}`}
            tabIndex={tab === t.id ? 0 : -1}
            onClick={() => setTab(t.id)}
            onKeyDown={(event) => onKeyDown(event, index)}
            className={`min-h-touch rounded-lg border-2 px-4 font-semibold ${
              tab === t.id ? 'border-brass-500 bg-brass-50 text-steel-950' : 'border-steel-200 bg-white text-steel-700 hover:bg-steel-100'
            }`}
          >
            {t.label}
          </button>
        ))}
      </div>
      {TABS.map((t) => (
        <section
          key={t.id}
          id={`results-panel-${t.id}`}
          role="tabpanel"
          aria-labelledby={`results-tab-${t.id}`}
          hidden={tab !== t.id}
          className="panel"
        >
          {t.id === 'learners' ? <ResultsTable results={results} /> : <StepAnalysis results={results} />}
        </section>
      ))}
    </div>
  );
}
