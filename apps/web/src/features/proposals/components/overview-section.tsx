import {
  DataList,
  HStack,
  Input,
  NativeSelect,
  SimpleGrid,
  Stack,
  Text,
  Textarea,
} from '@chakra-ui/react';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Controller, useForm, useWatch, type Path } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { type Proposal, type ProposalKind, proposalKeys, updateProposal } from '../api';
import { useAutosave } from '../autosave';
import { countWords } from '../format';
import { type FocusRequest, focusAfterNavigation } from '../focus';
import { useProposalOptions } from '../hooks';
import { kindLabel } from '../labels';
import { ConflictNotice, SaveStatus } from './save-status';

export interface OverviewValues {
  title: string;
  abstract: string;
  scienceCategory: string;
  kind: string;
  continues: string;
}

export const OVERVIEW_FIELDS = [
  'title',
  'abstract',
  'scienceCategory',
  'kind',
  'continues',
] as const satisfies readonly Path<OverviewValues>[];

export const OVERVIEW_LABELS: Record<(typeof OVERVIEW_FIELDS)[number], string> = {
  title: 'Title',
  abstract: 'Abstract',
  scienceCategory: 'Science category',
  kind: 'Kind',
  continues: 'Continues proposal',
};

const valuesOf = (proposal: Proposal): OverviewValues => ({
  title: proposal.title,
  abstract: proposal.abstract,
  scienceCategory: proposal.scienceCategory ?? '',
  kind: proposal.kind,
  continues: proposal.continues ?? '',
});

/** The PATCH body for the changed fields: empty choices go as null. */
function changeOf(changed: Partial<OverviewValues>) {
  return {
    ...(changed.title !== undefined && { title: changed.title }),
    ...(changed.abstract !== undefined && { abstract: changed.abstract }),
    ...(changed.scienceCategory !== undefined && {
      scienceCategory: changed.scienceCategory || null,
    }),
    ...(changed.kind !== undefined && { kind: changed.kind as ProposalKind }),
    ...(changed.continues !== undefined && { continues: changed.continues.trim() || null }),
  };
}

function WordCount({ text, limit }: { text: string; limit: number }) {
  const words = countWords(text);
  if (words > limit) {
    return (
      <StatusIndicator tone="warning" fontSize="sm">
        {words} of {limit} words: {words - limit} over the limit
      </StatusIndicator>
    );
  }
  return (
    <Text fontSize="sm" color="fg.muted">
      {words} of {limit} words
    </Text>
  );
}

function OverviewForm({ proposal, focus }: { proposal: Proposal; focus?: FocusRequest }) {
  const queryClient = useQueryClient();
  const options = useProposalOptions();
  const form = useForm<OverviewValues>({ defaultValues: valuesOf(proposal) });
  const {
    register,
    control,
    formState: { errors },
  } = form;
  const { reference } = proposal;
  const { state, save, resolve } = useAutosave({
    reference,
    form,
    fields: OVERVIEW_FIELDS,
    send: (version, changed) => updateProposal(reference, version, changeOf(changed)),
    enabled: true,
  });
  const [reloading, setReloading] = useState(false);
  const abstract = useWatch({ control, name: 'abstract' });

  const focusField = focus?.field;
  useEffect(() => {
    if (!focusField || !(OVERVIEW_FIELDS as readonly string[]).includes(focusField)) return;
    return focusAfterNavigation(() => form.setFocus(focusField as Path<OverviewValues>));
  }, [focus?.key, focusField, form]);

  const reload = async (keepMine: boolean) => {
    setReloading(true);
    try {
      await queryClient.refetchQueries({ queryKey: proposalKeys.detail(reference), exact: true });
      const theirs = queryClient.getQueryData<Proposal>(proposalKeys.detail(reference));
      if (theirs) resolve(valuesOf(theirs), keepMine);
    } finally {
      setReloading(false);
    }
  };

  const onBlur = () => void save();
  const categories = options.data?.scienceCategories ?? [];

  return (
    <form onSubmit={(event) => event.preventDefault()} noValidate aria-label="Overview">
      <Stack gap="5">
        <HStack justify="space-between" wrap="wrap" gap="3">
          <Text fontSize="sm" color="fg.muted">
            Changes are saved as you type.
          </Text>
          <SaveStatus state={state} lastChanged={proposal.updatedAt} onRetry={onBlur} />
        </HStack>
        {state.kind === 'conflict' && (
          <ConflictNotice
            pending={reloading}
            onReapply={() => void reload(true)}
            onDiscard={() => void reload(false)}
          />
        )}
        <FormField label={OVERVIEW_LABELS.title} error={errors.title} required>
          <Input {...register('title', { onBlur })} autoComplete="off" />
        </FormField>
        <FormField
          label={OVERVIEW_LABELS.abstract}
          error={errors.abstract}
          required
          helperText={<WordCount text={abstract} limit={proposal.abstractWordLimit} />}
        >
          <Textarea {...register('abstract', { onBlur })} rows={10} autoresize />
        </FormField>
        <SimpleGrid columns={{ base: 1, md: 2 }} gap="5">
          <FormField
            label={OVERVIEW_LABELS.scienceCategory}
            error={errors.scienceCategory}
            required
          >
            <NativeSelect.Root>
              {/* Controlled: the choices arrive after the form, and must not reset the value. */}
              <Controller
                control={control}
                name="scienceCategory"
                render={({ field }) => (
                  <NativeSelect.Field
                    {...field}
                    onBlur={() => {
                      field.onBlur();
                      onBlur();
                    }}
                  >
                    <option value="">Choose a category</option>
                    {field.value && !categories.includes(field.value) && (
                      <option value={field.value}>{field.value}</option>
                    )}
                    {categories.map((category) => (
                      <option key={category} value={category}>
                        {category}
                      </option>
                    ))}
                  </NativeSelect.Field>
                )}
              />
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </FormField>
          <FormField
            label={OVERVIEW_LABELS.kind}
            error={errors.kind}
            required
            helperText="Only the kinds this call takes."
          >
            <NativeSelect.Root>
              <NativeSelect.Field {...register('kind', { onBlur })}>
                {proposal.call.kinds.map((kind) => (
                  <option key={kind} value={kind}>
                    {kindLabel(kind)}
                  </option>
                ))}
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </FormField>
        </SimpleGrid>
        <FormField
          label={OVERVIEW_LABELS.continues}
          error={errors.continues}
          helperText="The reference of an earlier proposal this one carries on, e.g. AU26-0012. Leave empty if none."
        >
          <Input
            {...register('continues', { onBlur })}
            autoComplete="off"
            fontFamily="mono"
            maxW="xs"
          />
        </FormField>
        <FormError error={errors.root?.server} />
      </Stack>
    </form>
  );
}

function OverviewReadOnly({ proposal }: { proposal: Proposal }) {
  const rows: [string, string][] = [
    [OVERVIEW_LABELS.title, proposal.title || '—'],
    [OVERVIEW_LABELS.scienceCategory, proposal.scienceCategory ?? '—'],
    [OVERVIEW_LABELS.kind, kindLabel(proposal.kind)],
    [OVERVIEW_LABELS.continues, proposal.continues ?? '—'],
  ];
  return (
    <Stack gap="5">
      <DataList.Root orientation="horizontal">
        {rows.map(([label, value]) => (
          <DataList.Item key={label}>
            <DataList.ItemLabel>{label}</DataList.ItemLabel>
            <DataList.ItemValue>{value}</DataList.ItemValue>
          </DataList.Item>
        ))}
      </DataList.Root>
      <Stack gap="1">
        <Text fontWeight="medium">{OVERVIEW_LABELS.abstract}</Text>
        <Text whiteSpace="pre-line" maxW="75ch">
          {proposal.abstract || '—'}
        </Text>
        <WordCount text={proposal.abstract} limit={proposal.abstractWordLimit} />
      </Stack>
    </Stack>
  );
}

export function OverviewSection({
  proposal,
  editable,
  focus,
}: {
  proposal: Proposal;
  editable: boolean;
  focus?: FocusRequest;
}) {
  return editable ? (
    <OverviewForm proposal={proposal} focus={focus} />
  ) : (
    <OverviewReadOnly proposal={proposal} />
  );
}
