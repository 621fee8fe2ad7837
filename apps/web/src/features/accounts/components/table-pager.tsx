import { Button, HStack, Text } from '@chakra-ui/react';

/** Previous / next through a list paged on the server, saying where we are in words. */
export function TablePager({
  page,
  pageCount,
  total,
  noun,
  onPage,
  label,
}: {
  page: number;
  pageCount: number;
  total: number;
  noun: string;
  onPage: (page: number) => void;
  label: string;
}) {
  return (
    <HStack as="nav" aria-label={label} justify="space-between" mt="3" gap="3" wrap="wrap">
      <Button size="sm" variant="outline" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous
      </Button>
      <Text fontSize="sm" color="fg.muted" aria-live="polite">
        Page {page} of {Math.max(1, pageCount)} · {total} {noun}
      </Text>
      <Button
        size="sm"
        variant="outline"
        disabled={page >= pageCount}
        onClick={() => onPage(page + 1)}
      >
        Next
      </Button>
    </HStack>
  );
}
