import { memo } from 'react';
/** Says so when the scenario belongs to a shared set the user may read but not change. */
import { useQuery } from '@tanstack/react-query';
import { localScenarioQuery, remoteSetsQuery } from '../../../store/hooks';

// memo: a stress step re-renders the page, not this
export const ReadOnlyNote = memo(function ReadOnlyNote({ scenarioId }: { scenarioId: string }) {
  const stored = useQuery(localScenarioQuery(scenarioId));
  const sets = useQuery(remoteSetsQuery);
  const set = sets.data?.find((s) => s.id === stored.data?.setId);
  if (!set || set.canWrite) return null;
  return (
    <p className="text-xs text-warn" data-testid="read-only-note">
      Read only for you in “{set.name}”: edits stay on this device as your own copy.
    </p>
  );
});
