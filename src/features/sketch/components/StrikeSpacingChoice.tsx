import { memo } from 'react';
import type { StrikeSpacing } from '../../../engine/analytic';

interface Props {
  /** the scenario's spacing; absent in documents from before it could be chosen */
  value: StrikeSpacing | undefined;
  onChange: (value: StrikeSpacing) => void;
  disabled?: boolean;
}

const CHOICES: { value: StrikeSpacing; label: string; title: string }[] = [
  {
    value: 'standard-deviations',
    label: '±4 s.d.',
    title:
      "each expiry's strikes over ±4 of its own ATM standard deviations, closer near the money",
  },
  {
    value: 'log-moneyness',
    label: 'Fixed ln(K/F)',
    title: "the scenario's one list of ln(K/F) for every expiry",
  },
];

/** Where each panel's strikes sit: in the expiry's own standard deviations or one fixed list. */
// memo: a stress step re-renders the page, not this
export const StrikeSpacingChoice = memo(function StrikeSpacingChoice({
  value,
  onChange,
  disabled,
}: Props) {
  const current = value ?? 'log-moneyness';
  return (
    <div role="radiogroup" aria-label="Strikes" className="flex items-center gap-1 text-sm">
      <span className="text-muted">Strikes</span>
      {CHOICES.map((c) => (
        <button
          key={c.value}
          type="button"
          role="radio"
          aria-checked={current === c.value}
          title={c.title}
          disabled={disabled}
          onClick={() => onChange(c.value)}
          className={`rounded px-2 py-0.5 ${current === c.value ? 'bg-ink text-paper' : 'text-muted hover:text-ink'}`}
        >
          {c.label}
        </button>
      ))}
    </div>
  );
});
