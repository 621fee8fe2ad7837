import { Button, CloseButton, Dialog, Portal, Stack, Text } from '@chakra-ui/react';
import { useRef, type ReactNode } from 'react';

export interface ConfirmDialogProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  title: string;
  /** What will happen, and what cannot be undone. */
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  /** The action is running: the confirm button shows it and the dialog stays open. */
  pending?: boolean;
  /** A refusal or failure to show inside the dialog. */
  error?: string | null;
  /** `danger` for what destroys or cannot be taken back. */
  tone?: 'default' | 'danger';
}

/**
 * Asks before an irreversible or destructive action. It is an alert dialog: focus starts on
 * Cancel, Escape and Cancel close it, and nothing happens until the confirm button is pressed.
 */
export function ConfirmDialog({
  open,
  onOpenChange,
  title,
  children,
  confirmLabel,
  onConfirm,
  pending = false,
  error,
  tone = 'default',
}: ConfirmDialogProps) {
  const cancel = useRef<HTMLButtonElement>(null);
  return (
    <Dialog.Root
      role="alertdialog"
      open={open}
      onOpenChange={(details) => onOpenChange(details.open)}
      initialFocusEl={() => cancel.current}
    >
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>{title}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Stack gap="3">
                {children}
                {error && (
                  <Text color="blocker.fg" role="alert">
                    {error}
                  </Text>
                )}
              </Stack>
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline" ref={cancel}>
                  Cancel
                </Button>
              </Dialog.ActionTrigger>
              <Button
                colorPalette={tone === 'danger' ? 'blocker' : 'brand'}
                loading={pending}
                onClick={onConfirm}
              >
                {confirmLabel}
              </Button>
            </Dialog.Footer>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" aria-label="Close" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
