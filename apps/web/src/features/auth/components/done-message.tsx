import { Alert } from '@chakra-ui/react';
import type { ReactNode } from 'react';

/** What happened after a form was sent, announced to screen readers as it appears. */
export function DoneMessage({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <Alert.Root status="success" colorPalette="success" role="status">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>{title}</Alert.Title>
        {children && <Alert.Description>{children}</Alert.Description>}
      </Alert.Content>
    </Alert.Root>
  );
}
