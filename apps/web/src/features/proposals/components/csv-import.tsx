import {
  Box,
  Button,
  Code,
  Field,
  Heading,
  HStack,
  List,
  Stack,
  Table,
  Text,
  Textarea,
} from '@chakra-ui/react';
import { formatDeclination, formatRightAscension } from '@skyhours/calc';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { useId, useState } from 'react';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import {
  type ImportPreview,
  type ImportRow,
  importTargets,
  previewTargetImport,
  type Proposal,
  proposalKeys,
} from '../api';
import { formatNumber } from '../format';
import { useProposalWrite } from '../hooks';
import { plural } from '../labels';
import { WriteError } from './write-error';

export const CSV_HEADER =
  'name,ra,dec,extent_arcsec,flux_mjy,rest_ghz,velocity_km_s,convention,redshift';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ImportRow>();

const angle = (deg: number | null, format: (deg: number) => string) =>
  deg === null || deg === undefined ? '—' : format(deg);

const columns = helper.columns([
  helper.accessor('line', { header: 'Line' }),
  helper.accessor('name', { header: 'Name', cell: (info) => info.getValue() ?? '—' }),
  helper.accessor('raDeg', {
    header: 'RA',
    cell: (info) => angle(info.getValue(), (deg) => formatRightAscension(deg, 1)),
  }),
  helper.accessor('decDeg', {
    header: 'Dec',
    cell: (info) => angle(info.getValue(), (deg) => formatDeclination(deg, 0)),
  }),
  helper.display({
    id: 'extent',
    header: 'Extent (″)',
    cell: ({ row }) => formatNumber(row.original.extentArcsec ?? null),
  }),
  helper.display({
    id: 'line-frequency',
    header: 'Rest (GHz)',
    cell: ({ row }) => formatNumber(row.original.restGHz ?? null, 7),
  }),
  helper.display({
    id: 'problems',
    header: 'Problems',
    cell: ({ row }) =>
      row.original.errors.length === 0 ? (
        <StatusIndicator tone="success">Ready</StatusIndicator>
      ) : (
        <List.Root as="ul" ps="0" listStyle="none" gap="1">
          {row.original.errors.map((error) => (
            <List.Item key={`${error.column}-${error.message}`}>
              <StatusIndicator tone="blocker">
                {error.column}: {error.message}
              </StatusIndicator>
            </List.Item>
          ))}
        </List.Root>
      ),
  }),
]);

function PreviewTable({ preview }: { preview: ImportPreview }) {
  const table = useTable({
    features,
    columns,
    data: preview.rows,
    getRowId: (row) => String(row.line),
  });
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md" maxH="sm">
      <Table.Root size="sm" stickyHeader>
        <Table.Caption srOnly>Rows to import</Table.Caption>
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
            <Table.Row
              key={row.id}
              data-invalid={row.original.errors.length > 0 || undefined}
              bg={row.original.errors.length > 0 ? 'blocker.subtle' : undefined}
            >
              {row.getAllCells().map((cell) => (
                <Table.Cell key={cell.id} verticalAlign="top" fontVariantNumeric="tabular-nums">
                  <table.FlexRender cell={cell} />
                </Table.Cell>
              ))}
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}

/** The issues of a refused import (`rows.3.dec`) as sentences naming the row. */
function importIssues(error: unknown): string[] {
  if (!isApiError(error, 400)) return [];
  return error.issues.map((issue) => {
    const match = /^rows\.(\d+)\.?(.*)$/.exec(issue.path);
    return match
      ? `Row ${Number(match[1]) + 1}${match[2] ? `, ${match[2]}` : ''}: ${issue.message}`
      : issue.message;
  });
}

/**
 * Targets from a table: paste CSV or choose a file, see every row as the server reads it (a dry
 * run, nothing saved), then import them all at once — only when no row has a problem.
 */
export function CsvImport({ proposal, onDone }: { proposal: Proposal; onDone: () => void }) {
  const { reference } = proposal;
  const queryClient = useQueryClient();
  const fileId = useId();
  const [csv, setCsv] = useState('');
  const [checked, setChecked] = useState<{ csv: string; preview: ImportPreview } | null>(null);

  const preview = useMutation({
    mutationFn: (text: string) => {
      const current = queryClient.getQueryData<Proposal>(proposalKeys.detail(reference));
      return previewTargetImport(reference, current?.version ?? proposal.version, text);
    },
    onSuccess: (result, text) => setChecked({ csv: text, preview: result }),
  });
  const save = useProposalWrite(reference, (version, text: string) =>
    importTargets(reference, version, text),
  );

  const runPreview = (text: string) => {
    save.reset();
    if (text.trim() !== '') preview.mutate(text);
  };

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    const text = await file.text();
    setCsv(text);
    runPreview(text);
  };

  const current = checked && checked.csv === csv ? checked.preview : null;
  const outdated = checked !== null && checked.csv !== csv;
  const valid = current?.valid ?? 0;
  const invalid = current?.invalid ?? 0;
  const blocked = !current || invalid > 0 || valid === 0;
  const reason = !current
    ? outdated
      ? 'The text changed since the preview: preview it again.'
      : 'Preview the rows first.'
    : invalid > 0
      ? `${plural(invalid, 'row has', 'rows have')} problems: correct ${invalid === 1 ? 'it' : 'them'} in the text and preview again.`
      : valid === 0
        ? 'There are no rows to import.'
        : null;

  return (
    <Box borderWidth="1px" rounded="md" p="4" as="section" aria-labelledby="csv-heading">
      <Stack gap="4">
        <Heading as="h4" size="sm" id="csv-heading">
          Import targets from CSV
        </Heading>
        <Text fontSize="sm" color="fg.muted">
          One target a line, with this header (name, ra and dec are required; coordinates as in the
          target form): <Code fontSize="xs">{CSV_HEADER}</Code>
        </Text>
        <Field.Root>
          <Field.Label>CSV text</Field.Label>
          <Textarea
            value={csv}
            onChange={(event) => setCsv(event.target.value)}
            rows={6}
            fontFamily="mono"
            fontSize="sm"
            spellCheck={false}
            placeholder={`${CSV_HEADER}\nNGC 9001,10:00:24.0,+22:30:00,30,12,,,,`}
          />
        </Field.Root>
        <HStack gap="3" wrap="wrap">
          <Button
            variant="outline"
            onClick={() => runPreview(csv)}
            loading={preview.isPending}
            disabled={csv.trim() === ''}
          >
            Preview the rows
          </Button>
          <Field.Root width="auto">
            <Field.Label htmlFor={fileId} fontSize="sm">
              Or choose a CSV file
            </Field.Label>
            <input
              id={fileId}
              type="file"
              accept=".csv,text/csv,text/plain"
              onChange={(event) => void onFile(event.target.files?.[0])}
            />
          </Field.Root>
        </HStack>
        {preview.isError && <WriteError error={preview.error} reference={reference} />}
        {current && (
          <Stack gap="2">
            <HStack gap="4" wrap="wrap" role="status">
              <StatusIndicator tone="success">{plural(valid, 'row')} ready</StatusIndicator>
              {invalid > 0 && (
                <StatusIndicator tone="blocker">
                  {plural(invalid, 'row')} with problems
                </StatusIndicator>
              )}
            </HStack>
            <PreviewTable preview={current} />
          </Stack>
        )}
        {importIssues(save.error).length > 0 && (
          <List.Root role="alert" color="blocker.fg" ps="5">
            {importIssues(save.error).map((message) => (
              <List.Item key={message}>{message}</List.Item>
            ))}
          </List.Root>
        )}
        {save.isError && !isApiError(save.error, 400) && (
          <WriteError error={save.error} reference={reference} />
        )}
        <HStack gap="3" wrap="wrap">
          <Button
            disabled={blocked}
            loading={save.isPending}
            aria-describedby={reason ? 'csv-import-reason' : undefined}
            onClick={() =>
              save.mutate(csv, {
                onSuccess: () => {
                  toaster.create({ type: 'success', title: `Imported ${plural(valid, 'target')}` });
                  onDone();
                },
              })
            }
          >
            {current ? `Import ${plural(valid, 'target')}` : 'Import the targets'}
          </Button>
          <Button variant="outline" onClick={onDone}>
            Cancel
          </Button>
          {reason && (
            <Text id="csv-import-reason" fontSize="sm" color="fg.muted">
              {reason}
            </Text>
          )}
        </HStack>
      </Stack>
    </Box>
  );
}
