import { memo } from 'react';
/** The caution every pricing or risk view carries. */
// memo: a stress step re-renders the page, not this
export const CautionNote = memo(function CautionNote() {
  return (
    <p
      role="note"
      className="rounded-md border border-warn/40 bg-warn/5 px-3 py-2 text-sm text-ink/80"
    >
      <strong className="font-semibold">Model output for analysis, not trading advice.</strong>{' '}
      Results depend on the model and its parameters. Validate them under your firm&apos;s
      model-risk policy and the rules that apply where you trade.
    </p>
  );
});
