import { Button, HStack, Text } from '@chakra-ui/react';

export interface ListPagerProps {
  /** 1-based. */
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
  /** The navigation landmark's name, e.g. "Pages of your proposals". */
  label: string;
  /** What is counted, plural: "proposals". */
  noun: string;
}

/** Previous / next through a list paged on the server, saying where we are in words. */
export function ListPager({ page, pageSize, total, onPage, label, noun }: ListPagerProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (pages === 1) return null;
  return (
    <HStack as="nav" aria-label={label} justify="space-between" mt="3" gap="3" wrap="wrap">
      <Button size="sm" variant="outline" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous
      </Button>
      <Text fontSize="sm" color="fg.muted" aria-live="polite">
        Page {page} of {pages} · {total} {noun}
      </Text>
      <Button size="sm" variant="outline" disabled={page >= pages} onClick={() => onPage(page + 1)}>
        Next
      </Button>
    </HStack>
  );
}
