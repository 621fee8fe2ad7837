import { Alert, Button, HStack, Spinner, Text } from '@chakra-ui/react';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { formatInstant } from '@/lib/time';
import type { SaveState } from '../autosave';
import { formatClock } from '../format';

/**
 * Where the autosave stands, in words, announced politely: "Saving…", "Saved · 12:04",
 * "Not saved — retry". A conflict is shown apart, as an alert (see ConflictNotice).
 */
export function SaveStatus({
  state,
  lastChanged,
  onRetry,
}: {
  state: SaveState;
  /** The proposal's updatedAt, for before the first save here. */
  lastChanged: string;
  onRetry: () => void;
}) {
  let content;
  switch (state.kind) {
    case 'idle':
      content = (
        <Text color="fg.muted" fontSize="sm">
          Saved · last changed {formatInstant(lastChanged)}
        </Text>
      );
      break;
    case 'saving':
      content = (
        <HStack gap="2" color="fg.muted" fontSize="sm">
          <Spinner size="xs" aria-hidden />
          <Text>Saving…</Text>
        </HStack>
      );
      break;
    case 'saved':
      content = (
        <StatusIndicator tone="success" fontSize="sm">
          Saved · {formatClock(state.at)}
        </StatusIndicator>
      );
      break;
    case 'invalid':
      content = (
        <StatusIndicator tone="blocker" fontSize="sm">
          Not saved — correct the marked field
        </StatusIndicator>
      );
      break;
    case 'failed':
      content = (
        <HStack gap="2" wrap="wrap">
          <StatusIndicator tone="blocker" fontSize="sm" title={state.message}>
            Not saved — {state.message}
          </StatusIndicator>
          <Button size="xs" variant="outline" onClick={onRetry}>
            Retry
          </Button>
        </HStack>
      );
      break;
    case 'conflict':
      content = (
        <StatusIndicator tone="warning" fontSize="sm">
          Not saved — someone else changed this proposal
        </StatusIndicator>
      );
      break;
  }
  return (
    <div role="status" aria-live="polite" data-save-state={state.kind}>
      {content}
    </div>
  );
}

/** After a 409: what happened, that the text is kept, and the two ways on. */
export function ConflictNotice({
  onReapply,
  onDiscard,
  pending,
}: {
  onReapply: () => void;
  onDiscard: () => void;
  pending: boolean;
}) {
  return (
    <Alert.Root status="warning" colorPalette="warning" role="alert" alignItems="start">
      <Alert.Indicator />
      <Alert.Content gap="3">
        <Alert.Title>
          Someone else changed this proposal; your text is kept below — reload their version and
          re-apply?
        </Alert.Title>
        <Alert.Description>
          Re-applying saves your text over theirs in the fields you changed; their other changes
          stay. Or take their version and drop your unsaved edits.
        </Alert.Description>
        <HStack gap="2" wrap="wrap">
          <Button size="sm" onClick={onReapply} loading={pending}>
            Reload and re-apply my text
          </Button>
          <Button size="sm" variant="outline" onClick={onDiscard} disabled={pending}>
            Take their version
          </Button>
        </HStack>
      </Alert.Content>
    </Alert.Root>
  );
}
