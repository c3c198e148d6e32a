import type { ReactNode } from 'react';

// One scored line as every island shows it: a ✓ or ✗ that screen readers hear as "Right:" or "Wrong:".

export interface ResultLineProps {
  ok: boolean;
  /** Classes of the line itself (it is always a flex row). */
  className?: string;
  /** Classes of the mark besides its colour. */
  markClass?: string;
  children: ReactNode;
}

export function ResultLine({ ok, className = '', markClass = '', children }: ResultLineProps) {
  return (
    <li className={`flex gap-2 ${className}`.trim()}>
      <span aria-hidden="true" className={`${markClass} ${ok ? 'text-go-700' : 'text-signal-700'}`.trim()}>
        {ok ? '✓' : '✗'}
      </span>
      <span>
        <span className="sr-only">{ok ? 'Right: ' : 'Wrong: '}</span>
        {children}
      </span>
    </li>
  );
}
