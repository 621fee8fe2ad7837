import { EmptyState as ChakraEmptyState, VStack } from '@chakra-ui/react';
import type { LucideIcon } from 'lucide-react';
import type { ReactNode } from 'react';

export interface EmptyStateProps {
  icon: LucideIcon;
  title: string;
  description?: ReactNode;
  /** What the user can do about it: a link or a button. */
  action?: ReactNode;
}

/** What a list or a screen shows when there is nothing in it yet. */
export function EmptyState({ icon: IconComponent, title, description, action }: EmptyStateProps) {
  return (
    <ChakraEmptyState.Root size="lg">
      <ChakraEmptyState.Content>
        <ChakraEmptyState.Indicator>
          <IconComponent aria-hidden />
        </ChakraEmptyState.Indicator>
        <VStack textAlign="center" gap="2">
          <ChakraEmptyState.Title>{title}</ChakraEmptyState.Title>
          {description && (
            <ChakraEmptyState.Description>{description}</ChakraEmptyState.Description>
          )}
        </VStack>
        {action}
      </ChakraEmptyState.Content>
    </ChakraEmptyState.Root>
  );
}
