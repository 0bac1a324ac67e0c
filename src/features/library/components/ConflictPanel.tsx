/** A conflict: the fields where my edit and the server's revision differ, and three ways out. */
import { ConflictChoices } from '../../../components/ConflictChoices';
import { differingFields } from '../../../sync/conflicts';
import type { StoredScenario } from '../../../store/db';
import { documentFieldLabel } from '../../../engine/core';

const show = (v: unknown) =>
  v === undefined ? '—' : typeof v === 'string' ? v : JSON.stringify(v);

export function ConflictPanel({
  scenario,
  onResolve,
}: {
  scenario: StoredScenario;
  onResolve: (how: 'mine' | 'theirs' | 'both') => void;
}) {
  const c = scenario.conflict!;
  const diffs = c.deleted ? [] : differingFields(scenario.document, c.document);
  return (
    <div
      className="space-y-3 rounded-md border border-stressed/40 bg-stressed/5 p-3"
      data-testid="conflict-panel"
    >
      <p className="text-sm">
        {c.deleted
          ? 'Someone deleted this scenario on the service while you edited it here.'
          : `The service has revision ${c.revision}, written while you edited this copy.`}
      </p>
      {diffs.length > 0 && (
        <table className="w-full text-left text-sm">
          <thead className="text-xs text-muted">
            <tr>
              <th className="font-normal">field</th>
              <th className="font-normal">mine (this device)</th>
              <th className="font-normal">theirs (revision {c.revision})</th>
            </tr>
          </thead>
          <tbody>
            {diffs.slice(0, 40).map((d) => (
              <tr key={d.path} className="border-t border-rule/60 align-top">
                <td className="pr-3 text-xs" title={d.path}>
                  {documentFieldLabel(d.path)}
                </td>
                <td className="max-w-xs break-words pr-3">{show(d.mine)}</td>
                <td className="max-w-xs break-words">{show(d.theirs)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <ConflictChoices onResolve={onResolve} />
    </div>
  );
}
