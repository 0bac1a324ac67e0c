/** A desk's members: leads change roles and remove people; anyone can leave. */
import type { Member, Role } from '../../../api/desks';

export function MembersTable({
  members,
  me,
  isLead,
  onRole,
  onRemove,
}: {
  members: Member[];
  me: string;
  isLead: boolean;
  onRole: (userId: string, role: Role) => void;
  onRemove: (m: Member) => void;
}) {
  return (
    <table className="w-full max-w-3xl text-left text-[15px]" data-testid="members">
      <thead className="border-b border-rule text-sm text-muted">
        <tr>
          <th className="py-2 font-normal">Member</th>
          <th className="py-2 font-normal">E-mail</th>
          <th className="py-2 font-normal">Role</th>
          <th />
        </tr>
      </thead>
      <tbody>
        {members.map((m) => (
          <tr key={m.id} className="border-b border-rule/60">
            <td className="py-2">
              {m.name}
              {m.id === me && <span className="text-muted"> (you)</span>}
            </td>
            <td className="py-2 text-muted">{m.email}</td>
            <td className="py-2">
              {isLead ? (
                <select
                  aria-label={`Role of ${m.name}`}
                  value={m.role}
                  onChange={(e) => onRole(m.id, e.target.value as Role)}
                  className="rounded border border-rule bg-panel px-2 py-1"
                >
                  <option value="lead">lead</option>
                  <option value="trader">trader</option>
                  <option value="analyst">analyst</option>
                </select>
              ) : (
                m.role
              )}
            </td>
            <td className="py-2 text-right">
              {(isLead || m.id === me) && (
                <button
                  type="button"
                  className="text-sm text-muted hover:text-stressed"
                  onClick={() => onRemove(m)}
                >
                  {m.id === me ? 'Leave desk' : 'Remove'}
                </button>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
