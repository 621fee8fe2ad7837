import { Heading, HStack, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

export interface PageHeaderProps {
  title: string;
  description?: ReactNode;
  /** Buttons or links that act on the whole screen. */
  actions?: ReactNode;
}

/**
 * Every screen starts with one: it names the screen in the document title (React hoists the
 * `<title>` into the head) and in the single `h1`.
 */
export function PageHeader({ title, description, actions }: PageHeaderProps) {
  return (
    <HStack justify="space-between" align="start" gap="4" wrap="wrap" mb="6">
      <title>{`${title} · Skyhours`}</title>
      <Stack gap="1">
        <Heading as="h1" size="2xl" fontWeight="semibold">
          {title}
        </Heading>
        {description && <Text color="fg.muted">{description}</Text>}
      </Stack>
      {actions && <HStack gap="2">{actions}</HStack>}
    </HStack>
  );
}
