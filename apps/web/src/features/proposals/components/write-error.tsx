import { Alert, Button } from '@chakra-ui/react';
import { useState } from 'react';
import { isApiError } from '@/lib/api-client';
import { isStale, useReloadProposal } from '../hooks';

/**
 * Why a change was not saved. A change made on an out-of-date version offers to load the
 * newer one; the form above keeps what the user typed, so they can check it and send it again.
 */
export function WriteError({ error, reference }: { error: unknown; reference: string }) {
  const reload = useReloadProposal(reference);
  // Per error: a later refusal offers the reload again.
  const [reloadedFor, setReloadedFor] = useState<unknown>(null);
  const reloaded = reloadedFor !== null && reloadedFor === error;
  if (!error) return null;
  if (isStale(error)) {
    return (
      <Alert.Root status="warning" colorPalette="warning" role="alert">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>Someone else changed this proposal</Alert.Title>
          <Alert.Description>
            {reloaded
              ? 'Their version is loaded. Your input is kept: check it and save again.'
              : 'Nothing of yours was saved, and your input is kept. Load their version, then save again.'}
          </Alert.Description>
        </Alert.Content>
        {!reloaded && (
          <Button
            size="sm"
            variant="outline"
            onClick={() => void reload().then(() => setReloadedFor(error))}
          >
            Load their version
          </Button>
        )}
      </Alert.Root>
    );
  }
  const message = isApiError(error)
    ? error.issues.length > 0
      ? error.issues.map((issue) => issue.message).join(' ')
      : error.message
    : error instanceof Error
      ? error.message
      : 'Something went wrong.';
  return (
    <Alert.Root status="error" colorPalette="blocker" role="alert">
      <Alert.Indicator />
      <Alert.Title>Not saved: {message}</Alert.Title>
    </Alert.Root>
  );
}
