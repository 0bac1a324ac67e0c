/** A labelled text input with its error underneath. */
export function TextField({
  label,
  value,
  onChange,
  type = 'text',
  error,
  autoComplete,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  type?: 'text' | 'email' | 'password';
  error?: string | null;
  autoComplete?: string;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span>{label}</span>
      <input
        type={type}
        value={value}
        autoComplete={autoComplete}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={Boolean(error)}
        className="rounded-md border border-rule bg-panel px-3 py-1.5 text-[15px]"
      />
      {error && <span className="text-xs text-stressed">{error}</span>}
    </label>
  );
}
