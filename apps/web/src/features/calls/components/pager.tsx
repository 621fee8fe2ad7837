import { Button, HStack, Text } from '@chakra-ui/react';

/** Previous / next through a paged list, with where we are in words. */
export function Pager({
  page,
  pageSize,
  total,
  onPage,
  label,
}: {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
  label: string;
}) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (pages === 1) return null;
  return (
    <HStack as="nav" aria-label={label} justify="space-between" mt="3">
      <Button size="sm" variant="outline" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous
      </Button>
      <Text fontSize="sm" color="fg.muted">
        Page {page} of {pages} · {total} calls
      </Text>
      <Button size="sm" variant="outline" disabled={page >= pages} onClick={() => onPage(page + 1)}>
        Next
      </Button>
    </HStack>
  );
}
