import {
  Alert,
  Box,
  Button,
  Card,
  DataList,
  Field,
  HStack,
  Link,
  Progress,
  Stack,
  Text,
} from '@chakra-ui/react';
import { useQueryClient } from '@tanstack/react-query';
import { Download, FileText, Upload } from 'lucide-react';
import { useEffect, useId, useRef, useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { toaster } from '@/components/ui/toaster';
import { isApiError, type UploadProgress } from '@/lib/api-client';
import { formatInstant } from '@/lib/time';
import { type Proposal, scienceCaseUrl, uploadScienceCase } from '../api';
import { type FocusRequest, focusAfterNavigation } from '../focus';
import { formatBytes } from '../format';
import { isStale, writeProposal } from '../hooks';
import { plural } from '../labels';
import { WriteError } from './write-error';

type UploadState =
  | { kind: 'idle' }
  | { kind: 'sending'; filename: string; progress: UploadProgress | null }
  | { kind: 'refused'; filename: string; problems: string[] }
  | { kind: 'failed'; error: unknown };

/** What is wrong with a file before it is sent, in the words of the call's rules. */
function localProblems(file: File, proposal: Proposal): string[] {
  const problems: string[] = [];
  const pdf = file.type === 'application/pdf' || /\.pdf$/i.test(file.name);
  if (!pdf) problems.push(`${file.name} is not a PDF; the science case must be one.`);
  const limit = proposal.call.sizeLimitMB * 1024 * 1024;
  if (file.size > limit) {
    problems.push(
      `${file.name} is ${formatBytes(file.size)}; this call takes at most ${proposal.call.sizeLimitMB} MB.`,
    );
  }
  return problems;
}

function ScienceCaseCard({ proposal }: { proposal: Proposal }) {
  const document = proposal.scienceCase;
  if (!document) return null;
  return (
    <Card.Root variant="outline">
      <Card.Body>
        <Stack gap="3">
          <HStack gap="2">
            <FileText aria-hidden />
            <Text fontWeight="semibold" wordBreak="break-all">
              {document.filename}
            </Text>
          </HStack>
          <DataList.Root orientation="horizontal" size="sm">
            <DataList.Item>
              <DataList.ItemLabel>Pages</DataList.ItemLabel>
              <DataList.ItemValue>
                {document.pages} of at most {proposal.call.pageLimit}
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Size</DataList.ItemLabel>
              <DataList.ItemValue>{formatBytes(document.sizeBytes)}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Uploaded</DataList.ItemLabel>
              <DataList.ItemValue>
                <time dateTime={document.uploadedAt}>{formatInstant(document.uploadedAt)}</time>
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>SHA-256</DataList.ItemLabel>
              <DataList.ItemValue fontFamily="mono" fontSize="xs" title={document.sha256}>
                {document.sha256.slice(0, 16)}…
              </DataList.ItemValue>
            </DataList.Item>
          </DataList.Root>
          <Link
            href={scienceCaseUrl(proposal.reference)}
            download={document.filename}
            alignSelf="start"
          >
            <Download aria-hidden size="16" /> Download the science case
          </Link>
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}

export function DocumentsSection({
  proposal,
  editable,
  focus,
}: {
  proposal: Proposal;
  editable: boolean;
  focus?: FocusRequest;
}) {
  const queryClient = useQueryClient();
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const abort = useRef<AbortController | null>(null);
  const [state, setState] = useState<UploadState>({ kind: 'idle' });
  const { reference, call } = proposal;

  useEffect(() => {
    if (!focus || !editable) return;
    return focusAfterNavigation(() => input.current?.focus());
  }, [focus, editable]);
  useEffect(() => () => abort.current?.abort(), []);

  const send = async (file: File) => {
    const problems = localProblems(file, proposal);
    if (problems.length > 0) {
      setState({ kind: 'refused', filename: file.name, problems });
      return;
    }
    const controller = new AbortController();
    abort.current = controller;
    setState({ kind: 'sending', filename: file.name, progress: null });
    try {
      await writeProposal(queryClient, reference, (version) =>
        uploadScienceCase(reference, version, file, {
          signal: controller.signal,
          onProgress: (progress) => setState({ kind: 'sending', filename: file.name, progress }),
        }),
      );
      setState({ kind: 'idle' });
      toaster.create({ type: 'success', title: `${file.name} is the science case now` });
    } catch (error) {
      if (error instanceof DOMException && error.name === 'AbortError') {
        setState({ kind: 'idle' });
      } else if (isApiError(error) && [400, 413, 415, 422].includes(error.status)) {
        const problems =
          error.issues.length > 0 ? error.issues.map((issue) => issue.message) : [error.message];
        setState({ kind: 'refused', filename: file.name, problems });
      } else {
        setState({ kind: 'failed', error });
      }
    } finally {
      abort.current = null;
      if (input.current) input.current.value = '';
    }
  };

  const sending = state.kind === 'sending';
  const percent =
    state.kind === 'sending' && state.progress?.fraction !== undefined
      ? Math.round(state.progress.fraction * 100)
      : null;

  return (
    <Stack gap="6">
      <Text color="fg.muted" maxW="70ch">
        The science case is one PDF of at most {plural(call.pageLimit, 'page')} and{' '}
        {call.sizeLimitMB} MB, not encrypted.
        {call.anonymous
          ? ' Review in this call is anonymous: the names of the team must not appear in its text.'
          : ''}{' '}
        The compiled PDF referees read is a cover made from this proposal followed by it.
      </Text>
      {proposal.scienceCase ? (
        <ScienceCaseCard proposal={proposal} />
      ) : (
        <EmptyState
          icon={FileText}
          title="No science case yet"
          description={
            editable
              ? 'Upload it as a PDF; you can replace it until you submit.'
              : 'The team has not uploaded one.'
          }
        />
      )}

      {editable && (
        <Stack gap="3" maxW="xl">
          <Field.Root>
            <Field.Label htmlFor={inputId}>
              {proposal.scienceCase
                ? 'Replace the science case (PDF)'
                : 'Upload the science case (PDF)'}
            </Field.Label>
            <Box
              asChild
              fontSize="sm"
              css={{ '&::file-selector-button': { marginInlineEnd: '0.75rem' } }}
            >
              <input
                ref={input}
                id={inputId}
                type="file"
                accept="application/pdf,.pdf"
                disabled={sending}
                onChange={(event) => {
                  const file = event.target.files?.[0];
                  if (file) void send(file);
                }}
              />
            </Box>
          </Field.Root>

          {state.kind === 'sending' && (
            <Stack gap="2">
              <Progress.Root
                value={percent}
                max={100}
                colorPalette="brand"
                // The bar's own name, read with its value: "Uploading case.pdf: 40 %".
                translations={{
                  value: ({ value, percent }) =>
                    `Uploading ${state.filename}: ${value === null ? 'starting' : `${Math.round(percent)} %`}`,
                }}
              >
                <HStack justify="space-between" mb="1">
                  <Progress.Label>
                    <HStack gap="1">
                      <Upload aria-hidden size="14" /> Uploading {state.filename}
                    </HStack>
                  </Progress.Label>
                  <Progress.ValueText>
                    {percent === null ? 'starting…' : `${percent} %`}
                  </Progress.ValueText>
                </HStack>
                <Progress.Track>
                  <Progress.Range />
                </Progress.Track>
              </Progress.Root>
              <Button
                size="xs"
                variant="outline"
                alignSelf="start"
                onClick={() => abort.current?.abort()}
              >
                Cancel the upload
              </Button>
            </Stack>
          )}
          {state.kind === 'refused' && (
            <Alert.Root status="error" colorPalette="blocker" role="alert">
              <Alert.Indicator />
              <Alert.Content>
                <Alert.Title>{state.filename} was not accepted</Alert.Title>
                <Alert.Description>
                  <Stack gap="1">
                    {state.problems.map((problem) => (
                      <Text key={problem}>{problem}</Text>
                    ))}
                  </Stack>
                </Alert.Description>
              </Alert.Content>
            </Alert.Root>
          )}
          {state.kind === 'failed' &&
            (isStale(state.error) ? (
              <WriteError error={state.error} reference={reference} />
            ) : (
              <StatusIndicator tone="blocker" role="alert">
                Not uploaded:{' '}
                {state.error instanceof Error ? state.error.message : 'the upload failed'}. Choose
                the file again to retry.
              </StatusIndicator>
            ))}
        </Stack>
      )}
    </Stack>
  );
}
