import { useNavigate, useParams } from 'react-router-dom';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { toaster } from '@/components/ui/toaster';
import { callHref } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { callFormChoicesQueryOptions, callQueryOptions } from '../api';
import { CallForm, callToValues } from '../components/call-form';
import { QueryError } from '../components/query-error';
import { useCall, useCallFormChoices, useUpdateCall } from '../hooks';

function EditCallPage() {
  const { code = '' } = useParams();
  const navigate = useNavigate();
  const call = useCall(code);
  const choices = useCallFormChoices();
  const update = useUpdateCall(code);
  if (call.isPending || choices.isPending) return <PageLoader />;
  if (call.isError)
    return <QueryError error={call.error} onRetry={() => void call.refetch()} what="the call" />;
  if (choices.isError)
    return (
      <QueryError error={choices.error} onRetry={() => void choices.refetch()} what="the arrays" />
    );
  const current = call.data;
  return (
    <>
      <PageHeader
        title={`Edit ${current.code}`}
        description={
          current.status === 'open'
            ? 'The call is open: every change is recorded and e-mailed to the PIs with a draft in it.'
            : current.title
        }
      />
      <CallForm
        // A fresh form when the stored call changes under it.
        key={current.updatedAt}
        mode="edit"
        status={current.status}
        observatories={choices.data}
        defaultValues={callToValues(current)}
        submitLabel="Save changes"
        pending={update.isPending}
        onCancel={() => void navigate(callHref(current.code))}
        onSubmit={async ({ code: _code, observatoryId: _observatory, ...change }) => {
          const saved = await update.mutateAsync(change);
          toaster.create({ type: 'success', title: `Call ${saved.code} saved` });
          await navigate(callHref(saved.code));
        }}
      />
    </>
  );
}

export const route = defineRoute({
  Component: EditCallPage,
  loader:
    (queryClient) =>
    async ({ params }) => {
      await Promise.all([
        queryClient.ensureQueryData(callQueryOptions(params.code ?? '')),
        queryClient.ensureQueryData(callFormChoicesQueryOptions()),
      ]);
      return null;
    },
});
