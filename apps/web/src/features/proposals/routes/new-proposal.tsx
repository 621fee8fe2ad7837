import { Button, Card, HStack, Input, Link, NativeSelect, Stack, Text } from '@chakra-ui/react';
import { CalendarClock } from 'lucide-react';
import { useEffect, useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { FormError, FormField } from '@/components/ui/form-field';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { setServerErrors } from '@/lib/form-errors';
import { callHref, paths, proposalHref } from '@/lib/paths';
import { formatCountdown, formatLocalAndUtc } from '@/lib/time';
import { defineRoute } from '@/lib/route-module';
import {
  openCallsQueryOptions,
  proposalOptionsQueryOptions,
  type OpenCall,
  type ProposalKind,
} from '../api';
import { useCreateProposal, useNow, useOpenCalls, useProposalOptions } from '../hooks';
import { KIND_LABELS } from '../labels';

interface NewProposalValues {
  callCode: string;
  title: string;
  kind: ProposalKind | '';
  scienceCategory: string;
}

function NewProposalForm({ calls, categories }: { calls: OpenCall[]; categories: string[] }) {
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const now = useNow();
  const create = useCreateProposal();
  const requested = search.get('call');
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    control,
    formState: { errors },
  } = useForm<NewProposalValues>({
    defaultValues: {
      callCode: calls.find((c) => c.code === requested)?.code ?? calls[0]?.code ?? '',
      title: '',
      kind: 'standard',
      scienceCategory: '',
    },
  });
  const callCode = useWatch({ control, name: 'callCode' });
  const kind = useWatch({ control, name: 'kind' });
  const call = useMemo(() => calls.find((c) => c.code === callCode), [calls, callCode]);

  // A kind the chosen call does not take is never offered, nor kept.
  useEffect(() => {
    if (call && kind && !call.proposalKinds.includes(kind)) {
      setValue('kind', call.proposalKinds[0] ?? '');
    }
  }, [call, kind, setValue]);

  const onSubmit = handleSubmit((values) =>
    create.mutate(
      {
        callCode: values.callCode,
        title: values.title.trim(),
        kind: values.kind as ProposalKind,
        ...(values.scienceCategory ? { scienceCategory: values.scienceCategory } : {}),
      },
      {
        onSuccess: (proposal) => void navigate(proposalHref(proposal.reference)),
        onError: (error) => setServerErrors(error, setError, ['title', 'kind', 'scienceCategory']),
      },
    ),
  );

  const deadline = call ? formatLocalAndUtc(call.deadlineAt) : null;
  return (
    <Card.Root maxW="2xl">
      <Card.Body>
        <form onSubmit={onSubmit} noValidate>
          <Stack gap="5">
            <FormField label="Call" error={errors.callCode} required>
              <NativeSelect.Root>
                <NativeSelect.Field {...register('callCode', { required: 'Choose a call.' })}>
                  {calls.map((c) => (
                    <option key={c.code} value={c.code}>
                      {c.code} · {c.title}
                    </option>
                  ))}
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </FormField>
            {call && deadline && (
              <Text fontSize="sm" color="fg.muted">
                Deadline {deadline.local} ({deadline.utc}), {formatCountdown(call.deadlineAt, now)}.{' '}
                <Link asChild>
                  <RouterLink to={callHref(call.code)}>The call&apos;s rules</RouterLink>
                </Link>
              </Text>
            )}
            <FormField
              label="Title"
              error={errors.title}
              required
              helperText="You can change it later."
            >
              <Input
                {...register('title', {
                  validate: (value) => value.trim() !== '' || 'Give the proposal a title.',
                })}
                autoComplete="off"
              />
            </FormField>
            <FormField label="Kind" error={errors.kind} required>
              <NativeSelect.Root>
                <NativeSelect.Field {...register('kind', { required: 'Choose a kind.' })}>
                  {(call?.proposalKinds ?? []).map((k) => (
                    <option key={k} value={k}>
                      {KIND_LABELS[k]}
                    </option>
                  ))}
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </FormField>
            <FormField label="Science category" error={errors.scienceCategory}>
              <NativeSelect.Root>
                <NativeSelect.Field {...register('scienceCategory')}>
                  <option value="">Choose later</option>
                  {categories.map((category) => (
                    <option key={category} value={category}>
                      {category}
                    </option>
                  ))}
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </FormField>
            <FormError error={errors.root?.server} />
            <HStack gap="3">
              <Button type="submit" loading={create.isPending}>
                Create the draft
              </Button>
              <Button asChild variant="outline">
                <RouterLink to={paths.proposals}>Cancel</RouterLink>
              </Button>
            </HStack>
          </Stack>
        </form>
      </Card.Body>
    </Card.Root>
  );
}

function NewProposalPage() {
  const calls = useOpenCalls();
  const options = useProposalOptions();
  let body;
  if (calls.isPending || options.isPending) body = <BlockLoader label="Loading the open calls" />;
  else if (calls.isError)
    body = (
      <LoadError error={calls.error} what="the open calls" onRetry={() => void calls.refetch()} />
    );
  else if (options.isError)
    body = (
      <LoadError
        error={options.error}
        what="the proposal choices"
        onRetry={() => void options.refetch()}
      />
    );
  else if (calls.data.length === 0)
    body = (
      <EmptyState
        icon={CalendarClock}
        title="No call takes proposals right now"
        description="A proposal is written for an open call. The calls page shows when the next one opens."
        action={
          <Button asChild variant="outline">
            <RouterLink to={paths.calls}>See the calls</RouterLink>
          </Button>
        }
      />
    );
  else body = <NewProposalForm calls={calls.data} categories={options.data.scienceCategories} />;
  return (
    <>
      <PageHeader
        title="Start a proposal"
        description="It starts as a draft that only your team sees; the rest is added in the editor."
      />
      {body}
    </>
  );
}

export const route = defineRoute({
  Component: NewProposalPage,
  loader: (queryClient) => async () => {
    await Promise.all([
      queryClient.ensureQueryData(openCallsQueryOptions()),
      queryClient.ensureQueryData(proposalOptionsQueryOptions()),
    ]);
    return null;
  },
});
