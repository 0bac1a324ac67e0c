/** The three ways out of a sync conflict, for a scenario or a desk's book. */
export type ConflictChoice = 'mine' | 'theirs' | 'both';

const CHOICES: { how: ConflictChoice; label: string; style: string }[] = [
  { how: 'mine', label: 'Keep mine', style: 'border-teal text-teal' },
  { how: 'theirs', label: 'Take theirs', style: 'border-rule' },
  { how: 'both', label: 'Keep both (mine as a copy)', style: 'border-rule' },
];

export function ConflictChoices({
  onResolve,
  disabled = false,
}: {
  onResolve: (how: ConflictChoice) => void;
  disabled?: boolean;
}) {
  return (
    <div className="flex flex-wrap gap-3 text-sm">
      {CHOICES.map((c) => (
        <button
          key={c.how}
          type="button"
          disabled={disabled}
          className={`rounded border px-3 py-1 ${c.style}`}
          onClick={() => onResolve(c.how)}
        >
          {c.label}
        </button>
      ))}
    </div>
  );
}
