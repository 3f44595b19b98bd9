import { Link } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { useMyTasks } from '../../../features/field/api/get-my-tasks';
import { LogSignLauncher } from '../../../features/observations/components/log-sign-launcher';
import { Loading } from '../../../components/ui/card';
import { paths } from '../../../config/paths';

/** The crew's "Log sign" page: the properties of their tasks to choose from, the form, and what waits to send. */
export function FieldLogPage() {
  const me = useMe();
  const tasks = useMyTasks(me.data ?? { id: 0, role: 'crew' }, Boolean(me.data));
  if (!me.data) return <Loading />;
  const properties = [...new Map((tasks.data?.tasks ?? []).map((t) => [t.propertyId, { id: t.propertyId, name: t.propertyName }])).values()];
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm">
        <Link to={paths.field} className="text-moss-deep underline">
          Field sheet
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Log sign</h1>
      {properties.length === 0 && !tasks.isPending ? <p className="text-slate">Signs are logged on the properties of your tasks; you have none assigned yet.</p> : null}
      <LogSignLauncher userId={me.data.id} properties={properties} startOpen />
    </div>
  );
}
