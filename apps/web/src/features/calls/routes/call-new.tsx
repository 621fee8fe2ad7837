import { Button } from '@chakra-ui/react';
import { SatelliteDish } from 'lucide-react';
import { Link as RouterLink, useNavigate } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { toaster } from '@/components/ui/toaster';
import { callHref, paths } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { callFormChoicesQueryOptions } from '../api';
import { CallForm, emptyCallValues } from '../components/call-form';
import { QueryError } from '../components/query-error';
import { useCallFormChoices, useCreateCall } from '../hooks';

function NewCallPage() {
  const navigate = useNavigate();
  const choices = useCallFormChoices();
  const create = useCreateCall();
  if (choices.isPending) return <PageLoader />;
  if (choices.isError)
    return (
      <QueryError error={choices.error} onRetry={() => void choices.refetch()} what="the arrays" />
    );
  const observatories = choices.data;
  return (
    <>
      <PageHeader
        title="New call"
        description="The call starts as planned: only staff see it until you open it."
      />
      {observatories.length === 0 ? (
        <EmptyState
          icon={SatelliteDish}
          title="Describe the array first"
          description="A call offers time on an array's configurations."
          action={
            <Button asChild>
              <RouterLink to={paths.operationsArray}>Set up the array</RouterLink>
            </Button>
          }
        />
      ) : (
        <CallForm
          mode="create"
          observatories={observatories}
          defaultValues={emptyCallValues(observatories[0])}
          submitLabel="Create call"
          pending={create.isPending}
          onCancel={() => void navigate(paths.operationsCalls)}
          onSubmit={async (input) => {
            const call = await create.mutateAsync(input);
            toaster.create({ type: 'success', title: `Call ${call.code} created (planned)` });
            await navigate(callHref(call.code));
          }}
        />
      )}
    </>
  );
}

export const route = defineRoute({
  Component: NewCallPage,
  loader: (queryClient) => async () => {
    await queryClient.ensureQueryData(callFormChoicesQueryOptions());
    return null;
  },
});
