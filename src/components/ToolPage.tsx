/** The frame of a pricing or risk tool page: title, the caution, settings aside, results. */
import type { ReactNode } from 'react';
import { CautionNote } from './CautionNote';

export function ToolPage({
  title,
  asideWidth,
  aside,
  children,
}: {
  title: string;
  /** width of the settings column on large screens, e.g. "20rem" */
  asideWidth: string;
  aside: ReactNode;
  children: ReactNode;
}) {
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold">{title}</h1>
      <CautionNote />
      <div
        className="grid gap-6 lg:[grid-template-columns:var(--aside)_1fr]"
        style={{ '--aside': asideWidth } as React.CSSProperties}
      >
        <aside className="min-w-0 space-y-4">{aside}</aside>
        <section className="min-w-0 space-y-4">{children}</section>
      </div>
    </div>
  );
}
