import { Card, Stack } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { PageHeader } from '@/components/ui/page-header';

/** The narrow frame of the sign-in, registration and reset screens. */
export function AuthPanel({
  title,
  description,
  children,
}: {
  title: string;
  description?: ReactNode;
  children: ReactNode;
}) {
  return (
    <Stack maxW="md" mx="auto" w="full">
      <PageHeader title={title} description={description} />
      <Card.Root>
        <Card.Body>
          <Stack gap="5">{children}</Stack>
        </Card.Body>
      </Card.Root>
    </Stack>
  );
}
