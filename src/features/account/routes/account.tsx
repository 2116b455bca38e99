import { Loading } from '../../../components/ui/loading';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { useMe } from '../../../hooks/use-me';
import { roleName } from '../../../utils/roles';
import { UnitsForm } from '../components/units-form';

export function AccountPage() {
  const me = useMe();
  if (!me.data) return <Loading />;
  const { user, preferences } = me.data;
  return (
    <>
      <PageHeader title="Account" description="Who you are signed in as, and how numbers are shown to you." />
      <div className="grid max-w-3xl grid-cols-[minmax(0,1fr)] gap-4">
        <Panel title="Profile" description="Your administrator manages names, e-mail addresses and roles.">
          <dl className="grid grid-cols-[8rem_minmax(0,1fr)] gap-y-2 text-sm [&_dd]:break-words">
            <dt className="text-ink-muted">Name</dt>
            <dd>{user.name}</dd>
            <dt className="text-ink-muted">E-mail</dt>
            <dd>{user.email}</dd>
            <dt className="text-ink-muted">Role</dt>
            <dd>{roleName(user.role)}</dd>
          </dl>
        </Panel>
        <Panel title="Display units" description="Stormdraft stores every value in SI units and converts only for display.">
          <UnitsForm initial={preferences.units} />
        </Panel>
      </div>
    </>
  );
}
