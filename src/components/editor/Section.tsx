import type { ReactNode } from 'react';

// One titled part of the editor, reachable from the editor's table of contents.

export function Section({ id, title, intro, children }: { id: string; title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="panel scroll-mt-4">
      <h2 id={`${id}-heading`} className="mb-1 text-xl font-bold">
        {title}
      </h2>
      {intro && <div className="mb-4 text-steel-600">{intro}</div>}
      <div className="space-y-4">{children}</div>
    </section>
  );
}
