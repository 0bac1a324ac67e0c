import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import type { Role } from '../../../contracts';
import { useDeskActions } from '../hooks/use-desk-actions';
import { desksQuery, invitesQuery, membersQuery } from '../api/queries';
import { meQuery } from '../../../api/session';
import { MembersTable } from './MembersTable';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { formatDate } from '../../../components/format';

export function DeskPage() {
  const me = useQuery(meQuery);
  const signedIn = Boolean(me.data && !me.data.offline);
  const desks = useQuery({ ...desksQuery, enabled: signedIn });
  const [chosen, setChosen] = useState<string | null>(null);
  const [newDesk, setNewDesk] = useState('');
  const actions = useDeskActions();
  const { message } = actions;
  const desk = desks.data?.desks.find((d) => d.id === chosen) ?? desks.data?.desks[0];
  const isLead = desk?.role === 'lead';
  const members = useQuery({ ...membersQuery(desk?.id ?? ''), enabled: Boolean(desk) });
  const invites = useQuery({ ...invitesQuery(desk?.id ?? ''), enabled: Boolean(desk && isLead) });
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('trader');

  if (me.isPending) return <p className="text-muted">Opening…</p>;
  if (!me.data)
    return (
      <section className="space-y-3">
        <h1 className="text-2xl font-semibold">Desk</h1>
        <p>
          <Link to="/signin?next=/desk" className="text-teal">
            Sign in
          </Link>{' '}
          to see your desk, its members and invites. Scenarios on this device work without an
          account.
        </p>
      </section>
    );
  if (me.data.offline)
    return (
      <section className="space-y-3">
        <h1 className="text-2xl font-semibold">Desk</h1>
        <p className="text-muted">
          The sync service cannot be reached; the desk shows when it is back.
        </p>
      </section>
    );

  const create = async (e: FormEvent) => {
    e.preventDefault();
    const r = await actions.create(newDesk);
    if (r) {
      setChosen(r.desk.id);
      setNewDesk('');
    }
  };
  const invite = async (e: FormEvent) => {
    e.preventDefault();
    if (!desk) return;
    if (await actions.invite(desk.id, email, role)) setEmail('');
  };

  return (
    <section className="space-y-6">
      <h1 className="text-2xl font-semibold">Desk</h1>
      {desks.isPending ? (
        <p className="text-muted">Loading desks…</p>
      ) : desks.data?.desks.length === 0 ? (
        <p className="text-muted">
          You are on no desk yet. Create one, or accept an invite from a desk lead.
        </p>
      ) : (
        <div className="flex flex-wrap items-center gap-3">
          <label className="text-sm">
            Desk{' '}
            <select
              value={desk?.id}
              onChange={(e) => setChosen(e.target.value)}
              className="rounded border border-rule bg-panel px-2 py-1"
            >
              {desks.data?.desks.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.name}
                </option>
              ))}
            </select>
          </label>
          {desk && <span className="text-sm text-muted">your role: {desk.role}</span>}
        </div>
      )}
      <Notice message={message} />
      {desk && members.data && (
        <MembersTable
          members={members.data.members}
          me={me.data.user.id}
          isLead={isLead}
          onRole={(userId, r) => void actions.setRole(desk.id, userId, r)}
          onRemove={(m) => {
            const self = m.id === me.data!.user.id;
            if (
              !confirm(
                self
                  ? `Leave "${desk.name}"? Its shared sets leave this device.`
                  : `Remove ${m.name} from the desk?`,
              )
            )
              return;
            void actions.remove(desk.id, m.id, self ? 'You left the desk.' : `${m.name} removed.`);
          }}
        />
      )}
      {desk && isLead && (
        <div className="grid gap-6 md:grid-cols-2">
          <form onSubmit={(e) => void invite(e)} className="space-y-3" aria-label="invite">
            <h2 className="text-lg font-semibold">Invite by e-mail</h2>
            <TextField label="E-mail" type="email" value={email} onChange={setEmail} />
            <label className="flex flex-col gap-1 text-sm">
              <span>Role</span>
              <select
                value={role}
                onChange={(e) => setRole(e.target.value as Role)}
                className="rounded border border-rule bg-panel px-2 py-1.5"
              >
                <option value="trader">trader: edits the desk&apos;s sets</option>
                <option value="analyst">analyst: reads, replays, forks</option>
                <option value="lead">lead: manages members and sets</option>
              </select>
            </label>
            <button
              type="submit"
              className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper"
            >
              Send invite
            </button>
          </form>
          <div className="space-y-2">
            <h2 className="text-lg font-semibold">Pending invites</h2>
            {invites.data?.invites.length === 0 && <p className="text-sm text-muted">None.</p>}
            <ul className="space-y-1 text-sm" data-testid="invites">
              {invites.data?.invites.map((i) => (
                <li key={i.id} className="flex items-center gap-3">
                  <span>
                    {i.email} · {i.role} · until {formatDate(i.expiresAt)}
                  </span>
                  <button
                    type="button"
                    className="text-muted hover:text-stressed"
                    onClick={() => void actions.revoke(desk.id, i.id)}
                  >
                    Withdraw
                  </button>
                </li>
              ))}
            </ul>
          </div>
        </div>
      )}
      <form
        onSubmit={(e) => void create(e)}
        className="flex flex-wrap items-end gap-3"
        aria-label="new desk"
      >
        <TextField label="New desk" value={newDesk} onChange={setNewDesk} />
        <button type="submit" className="rounded-md border border-teal px-4 py-1.5 text-teal">
          Create desk
        </button>
      </form>
    </section>
  );
}
