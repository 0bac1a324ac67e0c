import type { RowIssue } from '../engine/core';

/** The rows a CSV upload rejected: line, field and reason. */
export function RowIssues({ issues }: { issues: RowIssue[] }) {
  if (issues.length === 0) return null;
  return (
    <ul
      className="max-h-40 overflow-auto rounded border border-stressed/30 p-2 text-xs text-stressed"
      aria-label="Rejected rows"
    >
      {issues.slice(0, 200).map((i) => (
        <li key={`${i.line}-${i.field}`}>
          line {i.line}, {i.field}: {i.message}
        </li>
      ))}
      {issues.length > 200 && <li>… and {issues.length - 200} more</li>}
    </ul>
  );
}
