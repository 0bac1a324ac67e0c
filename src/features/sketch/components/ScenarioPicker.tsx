import { memo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { localScenariosQuery } from '../../../store/hooks';

/** Switches the Sketch page between the scenarios kept on this device. */
// memo: a stress step re-renders the page, not this
export const ScenarioPicker = memo(function ScenarioPicker({ currentId }: { currentId: string }) {
  const scenarios = useQuery(localScenariosQuery);
  const navigate = useNavigate();
  if (!scenarios.data || scenarios.data.length < 2) return null;
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="text-xs font-semibold uppercase tracking-wide text-muted">
        Open scenario
      </span>
      <select
        value={currentId}
        onChange={(e) => navigate(`/?scenario=${e.target.value}`)}
        className="rounded border border-rule bg-panel px-2 py-1.5"
      >
        {scenarios.data.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </select>
    </label>
  );
});
