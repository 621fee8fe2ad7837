import { Center, HStack, Skeleton, Spinner, Stack, Text } from '@chakra-ui/react';

/** A whole screen (a lazy route, a first load) is on its way. */
export function PageLoader({ label = 'Loading…' }: { label?: string }) {
  return (
    <Center py="16" role="status" aria-live="polite">
      <HStack gap="3" color="fg.muted">
        <Spinner size="md" color="colorPalette.solid" aria-hidden />
        <Text>{label}</Text>
      </HStack>
    </Center>
  );
}

/** A block of a screen is on its way: grey lines where the text will be. */
export function BlockLoader({ label, lines = 3 }: { label: string; lines?: number }) {
  return (
    <Stack gap="2" role="status" aria-label={label} aria-busy>
      {Array.from({ length: lines }, (_, line) => (
        <Skeleton key={line} height="4" width={line === lines - 1 ? '60%' : '100%'} />
      ))}
    </Stack>
  );
}
