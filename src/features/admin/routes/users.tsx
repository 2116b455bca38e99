import type { QueryClient } from '@tanstack/react-query';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { useMe } from '../../../hooks/use-me';
import { usersQueryOptions, useUsers } from '../api/get-users';
import { CreateUserForm } from '../components/create-user-form';
import { UsersTable } from '../components/users-table';

/** Warms the user list while the page code loads. */
export const usersLoader = (queryClient: QueryClient) => () => queryClient.prefetchQuery(usersQueryOptions());

export function UsersPage() {
  const users = useUsers();
  const me = useMe();
  return (
    <>
      <PageHeader title="Users" description="Everyone who can sign in to this office: staff and alert subscribers." />
      <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-5 2xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div>
          {users.isPending ? <Loading label="Loading users…" /> : null}
          {users.isError ? (
            <Notice tone="error" title="We could not load the users">
              {users.error.message}
            </Notice>
          ) : null}
          {users.data ? <UsersTable users={users.data.users} currentUserId={me.data?.user.id ?? ''} /> : null}
        </div>
        <Panel className="max-w-xl" title="Create staff user" description="Forecasters, lead forecasters and administrators. Subscribers register themselves.">
          <CreateUserForm />
        </Panel>
      </div>
    </>
  );
}
