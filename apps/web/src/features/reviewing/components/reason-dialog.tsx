import { Button, Textarea } from '@chakra-ui/react';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormField } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';

/**
 * Declining an assignment or declaring a conflict: both ask for a reason and cannot be taken back
 * by the referee, so they are confirmed.
 */
export function ReasonDialog({
  trigger,
  title,
  explanation,
  confirmLabel,
  pending,
  onConfirm,
}: {
  trigger: string;
  title: string;
  explanation: string;
  confirmLabel: string;
  pending: boolean;
  onConfirm: (reason: string) => Promise<unknown>;
}) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const confirm = () => {
    if (reason.trim() === '') {
      setError('Say why, in a sentence.');
      return;
    }
    onConfirm(reason.trim()).then(
      () => setOpen(false),
      (e: unknown) => setError(isApiError(e) ? e.message : 'Something went wrong.'),
    );
  };
  return (
    <>
      <Button variant="outline" onClick={() => setOpen(true)}>
        {trigger}
      </Button>
      <ConfirmDialog
        open={open}
        onOpenChange={setOpen}
        title={title}
        confirmLabel={confirmLabel}
        onConfirm={confirm}
        pending={pending}
        error={error}
        tone="danger"
      >
        <p>{explanation}</p>
        <FormField label="Reason" required>
          <Textarea value={reason} onChange={(e) => setReason(e.target.value)} rows={3} />
        </FormField>
      </ConfirmDialog>
    </>
  );
}
