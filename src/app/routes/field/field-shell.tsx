import { Outlet } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { CompletionQueueProvider } from '../../../features/field/hooks/use-completion-queue';
import { Loading } from '../../../components/ui/card';

/** Every field page runs inside the completion queue, so a completion saved offline is sent from whichever page is open. */
export function FieldShell() {
  const me = useMe();
  if (!me.data) return <Loading />;
  return (
    <CompletionQueueProvider userId={me.data.id}>
      <Outlet />
    </CompletionQueueProvider>
  );
}
