/** A long job's progress with its Cancel button. */
export function ProgressBar({
  fraction,
  onCancel,
  testId,
}: {
  fraction: number;
  onCancel: () => void;
  testId: string;
}) {
  const percent = Math.round(100 * fraction);
  return (
    <div className="space-y-1" role="status">
      <div
        className="h-2 w-full rounded bg-rule"
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
      >
        <div className="h-2 rounded bg-teal" style={{ width: `${percent}%` }} />
      </div>
      <div className="flex justify-between text-xs text-muted">
        <span data-testid={testId}>{percent} %</span>
        <button type="button" className="text-stressed" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </div>
  );
}
