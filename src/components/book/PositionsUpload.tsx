import { useState, type DragEvent } from 'react';
import {
  parsePositionsCsv,
  MAX_POSITIONS_FILE_BYTES,
  type ParsedPositions,
} from '../../engine/positions-csv';
import type { Position } from '../../engine/positions';

interface Props {
  valuationDate: string;
  onAccept: (positions: Position[], mode: 'replace' | 'add') => void;
}

const EXAMPLE =
  'id,type,strike,expiry,quantity,tradePrice\nP1,put,3900,2026-12-18,-50,\nC1,call,4400,2027-03-19,25,\nH1,underlying,,,100,';

/** Upload (file, drop) or paste a positions CSV; bad rows are listed with line and reason. */
export function PositionsUpload({ valuationDate, onAccept }: Props) {
  const [text, setText] = useState('');
  const [result, setResult] = useState<ParsedPositions | null>(null);
  const [busy, setBusy] = useState(false);
  const parse = (t: string) => {
    setBusy(true);
    // let the "reading…" state paint before a large file is parsed
    setTimeout(() => {
      setResult(parsePositionsCsv(t, valuationDate));
      setBusy(false);
    }, 0);
  };
  const readFile = async (file: File) => {
    if (file.size > MAX_POSITIONS_FILE_BYTES) {
      setResult({
        positions: [],
        issues: [],
        fileError: `${file.name} is ${(file.size / 1024 / 1024).toFixed(1)} MB; the limit is ${MAX_POSITIONS_FILE_BYTES / 1024 / 1024} MB`,
      });
      return;
    }
    const t = await file.text();
    setText(t);
    parse(t);
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
            data-testid="positions-file"
            onChange={(e) => e.target.files?.[0] && void readFile(e.target.files[0])}
          />
        </label>
        <span className="text-xs text-muted">
          or drop a file here, or paste below · columns id, type (call/put/underlying), strike,
          expiry (date or years), quantity, tradePrice
        </span>
      </div>
      <textarea
        aria-label="Positions CSV"
        value={text}
        onChange={(e) => setText(e.target.value)}
        placeholder={EXAMPLE}
        rows={4}
        className="w-full rounded border border-rule bg-panel p-2 font-mono text-xs"
      />
      <div className="flex items-center gap-3">
        <button
          type="button"
          className="rounded border border-rule px-3 py-1 text-sm hover:border-teal"
          onClick={() => parse(text)}
          disabled={busy}
        >
          {busy ? 'Reading…' : 'Check rows'}
        </button>
        {result && result.positions.length > 0 && (
          <>
            <button
              type="button"
              className="rounded bg-teal px-3 py-1 text-sm font-semibold text-paper"
              onClick={() => {
                onAccept(result.positions, 'replace');
                setResult(null);
                setText('');
              }}
            >
              Replace book with {result.positions.length} legs
            </button>
            <button
              type="button"
              className="text-sm text-teal"
              onClick={() => {
                onAccept(result.positions, 'add');
                setResult(null);
                setText('');
              }}
            >
              Add to book
            </button>
          </>
        )}
      </div>
      {result?.fileError && (
        <p role="alert" className="text-sm text-stressed">
          {result.fileError}
        </p>
      )}
      {result && !result.fileError && (
        <p className="text-sm" data-testid="positions-parse-summary">
          {result.positions.length} good rows, {result.issues.length} rejected.
        </p>
      )}
      {result && result.issues.length > 0 && (
        <ul
          className="max-h-40 overflow-auto rounded border border-stressed/30 p-2 text-xs text-stressed"
          aria-label="Rejected rows"
        >
          {result.issues.slice(0, 200).map((i) => (
            <li key={`${i.line}-${i.field}`}>
              line {i.line}, {i.field}: {i.message}
            </li>
          ))}
          {result.issues.length > 200 && <li>… and {result.issues.length - 200} more</li>}
        </ul>
      )}
    </div>
  );
}
