import type { ReactNode } from 'react';

/** What an empty list says: what will appear here and how it gets there. */
export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <section className="pp-empty" aria-label={title}>
      <h2 className="pp-empty__title">{title}</h2>
      {children ? <div className="pp-empty__text">{children}</div> : null}
    </section>
  );
}
