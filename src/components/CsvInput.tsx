import { useState, type DragEvent } from 'react';

interface Props {
  /** what the columns are, shown beside the picker */
  hint: string;
  placeholder: string;
  maxBytes: number;
  testId: string;
  label: string;
  /** called with the text of a chosen, dropped or pasted file; or with a size error */
  onText: (text: string) => void;
  onTooLarge: (message: string) => void;
  /** an example file to load with one press (e.g. the invented demo chain) */
  sample?: { label: string; load: () => Promise<string> };
}

/** A CSV picker with drag and drop and a paste box. */
export function CsvInput({
  hint,
  placeholder,
  maxBytes,
  testId,
  label,
  onText,
  onTooLarge,
  sample,
}: Props) {
  const [text, setText] = useState('');
  const [loading, setLoading] = useState(false);
  const loadSample = async () => {
    if (!sample) return;
    setLoading(true);
    try {
      const t = await sample.load();
      setText(t);
      onText(t);
    } finally {
      setLoading(false);
    }
  };
  const readFile = async (file: File) => {
    if (file.size > maxBytes) {
      onTooLarge(
        `${file.name} is ${(file.size / 1024 / 1024).toFixed(1)} MB; the limit is ${maxBytes / 1024 / 1024} MB`,
      );
      return;
    }
    const t = await file.text();
    setText(t.length > 200_000 ? t.slice(0, 200_000) : t);
    onText(t);
  };
  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    const f = e.dataTransfer.files[0];
    if (f) void readFile(f);
  };
  return (
    <div className="space-y-2" onDragOver={(e) => e.preventDefault()} onDrop={onDrop}>
      <div className="flex flex-wrap items-center gap-3">
        <label className="cursor-pointer rounded border border-rule bg-panel px-3 py-1 text-sm hover:border-teal">
          Choose CSV…
          <input
            type="file"
            accept=".csv,text/csv,text/plain"
            className="sr-only"
            data-testid={testId}
            onChange={(e) => e.target.files?.[0] && void readFile(e.target.files[0])}
          />
        </label>
        {sample && (
          <button
            type="button"
            disabled={loading}
            onClick={() => void loadSample()}
            className="rounded border border-teal px-3 py-1 text-sm text-teal disabled:opacity-50"
          >
            {loading ? 'Loading…' : sample.label}
          </button>
        )}
        <span className="text-xs text-muted">or drop a file here, or paste below · {hint}</span>
      </div>
      <textarea
        aria-label={label}
        value={text}
        onChange={(e) => setText(e.target.value)}
        placeholder={placeholder}
        rows={4}
        className="w-full rounded border border-rule bg-panel p-2 font-mono text-xs"
      />
      <button
        type="button"
        className="rounded border border-rule px-3 py-1 text-sm hover:border-teal"
        onClick={() => onText(text)}
      >
        Check rows
      </button>
    </div>
  );
}
