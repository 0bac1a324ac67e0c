import type { ReactNode } from 'react';

/** A page that is not built yet says what will live there, and shows nothing made up. */
export function PagePlaceholder({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-labelledby="page-title" className="max-w-3xl space-y-4">
      <h1 id="page-title" className="text-2xl font-semibold">
        {title}
      </h1>
      <div className="space-y-3 text-[15px] leading-relaxed text-ink/85">{children}</div>
      <p className="text-sm text-muted">Not built yet in this version.</p>
    </section>
  );
}
