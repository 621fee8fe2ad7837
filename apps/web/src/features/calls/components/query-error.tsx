import { Alert, Button } from '@chakra-ui/react';

/** A part of the screen could not be loaded: say so and offer to try again. */
export function QueryError({
  error,
  onRetry,
  what,
}: {
  error: Error;
  onRetry: () => void;
  what: string;
}) {
  return (
    <Alert.Root status="error" colorPalette="blocker" role="alert">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>Could not load {what}</Alert.Title>
        <Alert.Description>{error.message}</Alert.Description>
      </Alert.Content>
      <Button size="sm" variant="outline" onClick={onRetry}>
        Try again
      </Button>
    </Alert.Root>
  );
}
