import {
  Heading,
  HStack,
  List,
  NativeSelect,
  SimpleGrid,
  Stack,
  Table,
  Text,
} from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { useState } from 'react';
import { FormField } from '@/components/ui/form-field';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { formatInstant } from '@/lib/time';
import type { ProposalVersion, VersionChange } from '../api';
import { formatHours } from '../format';
import { useComparison, useVersions } from '../hooks';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ProposalVersion>();

const submitter = (by: ProposalVersion['submittedBy']) =>
  by === null ? '—' : typeof by === 'string' ? by : by.name;

const columns = helper.columns([
  helper.accessor('number', { header: 'Version', cell: (info) => `Version ${info.getValue()}` }),
  helper.accessor('submittedAt', {
    header: 'Submitted',
    cell: (info) => <time dateTime={info.getValue()}>{formatInstant(info.getValue())}</time>,
  }),
  helper.accessor('submittedBy', { header: 'By', cell: (info) => submitter(info.getValue()) }),
  helper.accessor('totalHours', {
    header: 'Hours asked',
    cell: (info) => formatHours(info.getValue()),
  }),
]);

/** A value of a snapshot as a person reads it. */
function show(value: unknown): string {
  if (value === null || value === undefined || value === '') return '(none)';
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return value.map(show).join(', ');
  return Object.entries(value as Record<string, unknown>)
    .map(([key, item]) => `${key}: ${show(item)}`)
    .join('; ');
}

function Change({ change }: { change: VersionChange }) {
  return (
    <List.Item borderBottomWidth="1px" py="2">
      <Text fontWeight="medium">{change.label}</Text>
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="2" fontSize="sm">
        <Text>
          <Text as="span" color="fg.muted">
            Before:{' '}
          </Text>
          <Text as="del" textDecoration="line-through" textDecorationColor="fg.muted">
            {show(change.before)}
          </Text>
        </Text>
        <Text>
          <Text as="span" color="fg.muted">
            After:{' '}
          </Text>
          <Text as="ins" textDecoration="none" fontWeight="medium">
            {show(change.after)}
          </Text>
        </Text>
      </SimpleGrid>
    </List.Item>
  );
}

function Comparison({ reference, versions }: { reference: string; versions: ProposalVersion[] }) {
  const numbers = versions.map((v) => v.number).sort((a, b) => a - b);
  const [from, setFrom] = useState(numbers.at(-2) ?? null);
  const [to, setTo] = useState(numbers.at(-1) ?? null);
  const comparison = useComparison(reference, from, to);
  const choose = (label: string, value: number | null, onChange: (n: number) => void) => (
    <FormField label={label}>
      <NativeSelect.Root>
        <NativeSelect.Field
          value={value ?? ''}
          onChange={(event) => onChange(Number(event.target.value))}
        >
          {numbers.map((n) => (
            <option key={n} value={n}>
              Version {n}
            </option>
          ))}
        </NativeSelect.Field>
        <NativeSelect.Indicator />
      </NativeSelect.Root>
    </FormField>
  );
  return (
    <Stack gap="3" as="section" aria-labelledby="compare-heading">
      <Heading as="h4" size="sm" id="compare-heading">
        Compare two versions
      </Heading>
      <HStack gap="4" align="end" maxW="md">
        {choose('From', from, setFrom)}
        {choose('To', to, setTo)}
      </HStack>
      {from === to ? (
        <Text color="fg.muted">Choose two different versions.</Text>
      ) : comparison.isPending ? (
        <BlockLoader label="Comparing the versions" />
      ) : comparison.isError ? (
        <LoadError
          error={comparison.error}
          what="the comparison"
          onRetry={() => void comparison.refetch()}
        />
      ) : comparison.data.changes.length === 0 ? (
        <Text>
          Nothing changed between version {from} and version {to}.
        </Text>
      ) : (
        <List.Root
          as="ul"
          listStyle="none"
          ps="0"
          aria-label={`Changes from version ${from} to ${to}`}
        >
          {comparison.data.changes.map((change) => (
            <Change key={change.path} change={change} />
          ))}
        </List.Root>
      )}
    </Stack>
  );
}

/** Every submitted version, and what changed between any two. */
export function VersionsPanel({ reference }: { reference: string }) {
  const versions = useVersions(reference);
  const table = useTable({
    features,
    columns,
    data: versions.data ?? [],
    getRowId: (version) => String(version.number),
  });
  if (versions.isPending) return <BlockLoader label="Loading the submitted versions" />;
  if (versions.isError)
    return (
      <LoadError
        error={versions.error}
        what="the submitted versions"
        onRetry={() => void versions.refetch()}
      />
    );
  if (versions.data.length === 0) return null;
  return (
    <Stack gap="5" as="section" aria-labelledby="versions-heading">
      <Heading as="h3" size="md" id="versions-heading">
        Submitted versions
      </Heading>
      <Table.ScrollArea borderWidth="1px" rounded="md">
        <Table.Root size="sm">
          <Table.Caption srOnly>Submitted versions</Table.Caption>
          <Table.Header>
            {table.getHeaderGroups().map((group) => (
              <Table.Row key={group.id}>
                {group.headers.map((header) => (
                  <Table.ColumnHeader key={header.id}>
                    <table.FlexRender header={header} />
                  </Table.ColumnHeader>
                ))}
              </Table.Row>
            ))}
          </Table.Header>
          <Table.Body>
            {table.getRowModel().rows.map((row) => (
              <Table.Row key={row.id}>
                {row.getAllCells().map((cell) => (
                  <Table.Cell key={cell.id}>
                    <table.FlexRender cell={cell} />
                  </Table.Cell>
                ))}
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      {versions.data.length > 1 && <Comparison reference={reference} versions={versions.data} />}
    </Stack>
  );
}
