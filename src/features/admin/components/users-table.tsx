import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { roles, type Role } from '../../../../shared/contracts/common';
import type { UserSummary } from '../../../../shared/contracts/users';
import { formatTimestampUtc } from '../../../utils/time';
import { roleName } from '../../../utils/roles';
import { formFailureFrom } from '../../../utils/form';
import { useUpdateUser } from '../api/update-user';

const roleOptions = roles.map((role) => ({ value: role, label: roleName(role) }));

interface UsersTableProps {
  users: readonly UserSummary[];
  currentUserId: string;
}

export function UsersTable({ users, currentUserId }: UsersTableProps) {
  const updateUser = useUpdateUser();
  const [confirming, setConfirming] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const pendingUserId = updateUser.isPending ? updateUser.variables.userId : null;

  function change(user: UserSummary, changes: { role?: Role; disabled?: boolean }) {
    setProblem(null);
    updateUser.mutate(
      { userId: user.id, changes },
      {
        onSuccess: () => setConfirming(null),
        onError: (error) => setProblem(`${user.name}: ${formFailureFrom(error).message}`),
      },
    );
  }

  return (
    <div className="space-y-3">
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      <div className="relative overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full min-w-[36rem] text-left text-sm">
          <caption className="sr-only">Users of this office</caption>
          <thead className="border-b border-line bg-sunken text-[12px] font-semibold tracking-wide text-ink-muted uppercase">
            <tr>
              <th scope="col" className="px-3 py-2">Name</th>
              <th scope="col" className="px-3 py-2">E-mail</th>
              <th scope="col" className="px-3 py-2">Role</th>
              <th scope="col" className="px-3 py-2">Status</th>
              <th scope="col" className="px-3 py-2 text-right">Access</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-line">
            {users.map((user) => {
              const isSelf = user.id === currentUserId;
              const busy = pendingUserId === user.id;
              return (
                <tr key={user.id} className={user.disabled ? 'bg-sunken/60 text-ink-muted' : undefined}>
                  <th scope="row" className="px-3 py-2 font-medium">
                    {user.name}
                    {isSelf ? <span className="ml-1.5 rounded bg-accent-soft px-1.5 py-0.5 text-[11px] font-semibold text-accent-strong">you</span> : null}
                  </th>
                  <td className="px-3 py-2">
                    <span className="break-all">{user.email}</span>
                    <span className="block text-[12px] text-ink-faint">Since {formatTimestampUtc(user.createdAt)}</span>
                  </td>
                  <td className="px-3 py-1.5">
                    <SelectField
                      label={`Role of ${user.name}`}
                      hideLabel
                      value={user.role}
                      options={roleOptions}
                      disabled={busy || isSelf}
                      className="w-44"
                      onChange={(event) => {
                        const role = roles.find((r) => r === event.target.value);
                        if (role && role !== user.role) change(user, { role });
                      }}
                    />
                  </td>
                  <td className="px-3 py-2">
                    {user.disabled ? (
                      <span className="rounded bg-danger-soft px-1.5 py-0.5 text-[12px] font-semibold text-danger">Disabled</span>
                    ) : (
                      <span className="rounded bg-ok-soft px-1.5 py-0.5 text-[12px] font-semibold text-ok">Active</span>
                    )}
                  </td>
                  <td className="px-3 py-2 text-right whitespace-nowrap">
                    {isSelf ? (
                      <span className="text-[13px] text-ink-faint">—</span>
                    ) : confirming === user.id ? (
                      <span className="inline-flex items-center gap-2" role="group" aria-label={`Confirm for ${user.name}`}>
                        <span className="text-[13px]">{user.disabled ? 'Enable' : 'Disable'} {user.name}?</span>
                        <Button
                          size="sm"
                          variant={user.disabled ? 'primary' : 'danger'}
                          busy={busy}
                          onClick={() => change(user, { disabled: !user.disabled })}
                        >
                          {user.disabled ? 'Yes, enable' : 'Yes, disable'}
                        </Button>
                        <Button size="sm" variant="ghost" onClick={() => setConfirming(null)}>
                          Cancel
                        </Button>
                      </span>
                    ) : (
                      <Button size="sm" variant="secondary" disabled={busy} onClick={() => setConfirming(user.id)}>
                        {user.disabled ? 'Enable…' : 'Disable…'}
                      </Button>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-[13px] text-ink-muted">
        A disabled user cannot sign in and their open sessions end. Role changes apply to open sessions straight away.
      </p>
    </div>
  );
}
