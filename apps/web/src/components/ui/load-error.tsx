import { Alert, Button } from '@chakra-ui/react';

/** A screen or a part of it could not be loaded: say what, why, and offer to try again. */
export function LoadError({
  error,
  what,
  onRetry,
}: {
  error: Error;
  /** "the proposal", "the checks". */
  what: string;
  onRetry?: () => void;
}) {
  return (
    <Alert.Root status="error" colorPalette="blocker" role="alert">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>Could not load {what}</Alert.Title>
        <Alert.Description>{error.message}</Alert.Description>
      </Alert.Content>
      {onRetry && (
        <Button size="sm" variant="outline" onClick={onRetry}>
          Try again
        </Button>
      )}
    </Alert.Root>
  );
}
