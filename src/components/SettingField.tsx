/** A labelled setting typed as text (validated by the page's schema), and a seed with "New seed". */
export function SettingField({
  label,
  value,
  onChange,
  inputWidth = '8rem',
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  inputWidth?: string;
}) {
  return (
    <label
      className="grid items-center gap-2 text-sm"
      style={{ gridTemplateColumns: `1fr ${inputWidth}` }}
    >
      <span>{label}</span>
      <input
        aria-label={label}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className="tabular rounded border border-rule bg-panel px-2 py-1 text-right"
      />
    </label>
  );
}

export const newSeed = () => Math.floor(Math.random() * 2 ** 31);

export function SeedField({
  value,
  onChange,
  inputWidth,
}: {
  value: string;
  onChange: (v: string) => void;
  inputWidth?: string;
}) {
  return (
    <div className="flex items-end gap-2">
      <div className="flex-1">
        <SettingField label="Seed" value={value} onChange={onChange} inputWidth={inputWidth} />
      </div>
      <button
        type="button"
        className="text-sm text-teal"
        onClick={() => onChange(String(newSeed()))}
      >
        New seed
      </button>
    </div>
  );
}
