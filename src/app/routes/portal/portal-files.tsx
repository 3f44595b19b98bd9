import { usePortalFiles } from '../../../features/portal/api/get-portal-files';
import { usePortalProperties } from '../../../features/portal/api/get-portal-properties';
import { usePortalScope } from '../../../features/portal/api/portal-scope';
import { FilesList } from '../../../features/portal/components/files-list';
import { ClientUploadForm } from '../../../features/portal/components/client-upload-form';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';

/** Files: the documents the consultant shares, and the client's own uploads where allowed. */
export function PortalFilesPage() {
  const scope = usePortalScope();
  const files = usePortalFiles();
  const home = usePortalProperties();
  if (files.isPending) return <Loading label="Loading your files…" />;
  if (files.isError) return <ErrorPanel error={files.error} onRetry={() => void files.refetch()} />;
  const shared = files.data.filter((f) => f.uploadedByRole === 'staff');
  const own = files.data.filter((f) => f.uploadedByRole === 'client');
  const uploadsAllowed = home.data?.client.portalUploadsAllowed ?? false;
  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Files</h1>
        <p className="text-slate">Soil tests, maps and season reports from your consultant{uploadsAllowed ? ', and the files you send them' : ''}.</p>
      </div>
      <section aria-labelledby="shared-files" className="flex flex-col gap-2">
        <h2 id="shared-files" className="text-lg font-bold">
          From your consultant
        </h2>
        <FilesList files={shared} emptyText="Nothing shared yet. Soil tests, maps and reports appear here when your consultant shares them." />
      </section>
      {uploadsAllowed ? (
        <>
          <section aria-labelledby="own-files" className="flex flex-col gap-2">
            <h2 id="own-files" className="text-lg font-bold">
              Your uploads
            </h2>
            <FilesList files={own} emptyText="You have not uploaded anything yet." />
          </section>
          <Card title="Send your consultant a file">
            <ClientUploadForm properties={home.data?.properties ?? []} disabled={scope.readOnly} />
          </Card>
        </>
      ) : null}
    </div>
  );
}
