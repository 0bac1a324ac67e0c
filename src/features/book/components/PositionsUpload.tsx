import { useState } from 'react';
import {
  parsePositionsCsv,
  MAX_POSITIONS_FILE_BYTES,
  type Position,
  type ParsedPositions,
} from '../../../engine/book';
import { CsvInput } from '../../../components/CsvInput';
import { RowIssues } from '../../../components/RowIssues';

interface Props {
  valuationDate: string;
  onAccept: (positions: Position[], mode: 'replace' | 'add') => void;
}

const EXAMPLE =
  'id,type,strike,expiry,quantity,tradePrice\nP1,put,3900,2026-12-18,-50,\nC1,call,4400,2027-03-19,25,\nH1,underlying,,,100,';

/** Upload (file, drop) or paste a positions CSV; bad rows are listed with line and reason. */
export function PositionsUpload({ valuationDate, onAccept }: Props) {
  const [result, setResult] = useState<ParsedPositions | null>(null);
  const accept = (mode: 'replace' | 'add') => {
    if (result) onAccept(result.positions, mode);
    setResult(null);
  };
  return (
    <div className="space-y-2">
      <CsvInput
        hint="columns id, type (call/put/underlying), strike, expiry (date or years), quantity; optional tradePrice, multiplier (units per contract), currency"
        placeholder={EXAMPLE}
        maxBytes={MAX_POSITIONS_FILE_BYTES}
        testId="positions-file"
        label="Positions CSV"
        onText={(t) => setResult(parsePositionsCsv(t, valuationDate))}
        onTooLarge={(message) => setResult({ positions: [], issues: [], fileError: message })}
      />
      {result && result.positions.length > 0 && (
        <div className="flex items-center gap-3">
          <button
            type="button"
            className="rounded bg-teal px-3 py-1 text-sm font-semibold text-paper"
            onClick={() => accept('replace')}
          >
            Replace book with {result.positions.length} legs
          </button>
          <button type="button" className="text-sm text-teal" onClick={() => accept('add')}>
            Add to book
          </button>
        </div>
      )}
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
      {result && <RowIssues issues={result.issues} />}
    </div>
  );
}
