import {
  Button,
  CloseButton,
  Dialog,
  Input,
  NativeSelect,
  Portal,
  Stack,
  Textarea,
} from '@chakra-ui/react';
import { useForm, useWatch } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import type { LostReason, PlanRun, RunStatus } from '../api';
import { useUpdateRun } from '../hooks';
import { hoursText } from '../labels';

interface RecordForm {
  status: RunStatus;
  hoursObtained: string;
  qualityNote: string;
  lostReason: LostReason;
}

/** Records a run: observed (hours obtained and a quality note), lost (why), or planned again. */
export function RecordRunDialog({
  code,
  run,
  onClose,
}: {
  code: string;
  run: PlanRun | null;
  onClose: () => void;
}) {
  const update = useUpdateRun(code);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors },
  } = useForm<RecordForm>({
    values: {
      status: run?.status === 'planned' ? 'observed' : (run?.status ?? 'observed'),
      hoursObtained: String(run?.hoursObtained ?? run?.hours ?? ''),
      qualityNote: run?.qualityNote ?? '',
      lostReason: run?.lostReason ?? 'weather',
    },
  });
  const status = useWatch({ control, name: 'status' });
  const onSubmit = handleSubmit((values) => {
    if (!run) return;
    update.mutate(
      {
        id: run.id,
        change: {
          version: run.version,
          status: values.status,
          ...(values.status === 'observed'
            ? { hoursObtained: Number(values.hoursObtained), qualityNote: values.qualityNote }
            : {}),
          ...(values.status === 'lost' ? { lostReason: values.lostReason } : {}),
        },
      },
      {
        onSuccess: () => {
          toaster.create({ type: 'success', title: `Run of ${run.proposal.reference} recorded` });
          onClose();
        },
        onError: (error) =>
          setServerErrors(error, setError, [
            'status',
            'hoursObtained',
            'qualityNote',
            'lostReason',
          ]),
      },
    );
  });
  return (
    <Dialog.Root open={run !== null} onOpenChange={(d) => !d.open && onClose()} size="md">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content asChild>
            <form onSubmit={onSubmit} noValidate>
              <Dialog.Header>
                <Dialog.Title>
                  Record the run of {run?.proposal.reference} ({run ? hoursText(run.hours) : ''})
                </Dialog.Title>
              </Dialog.Header>
              <Dialog.Body>
                <Stack gap="4">
                  <FormField label="Outcome" error={errors.status}>
                    <NativeSelect.Root>
                      <NativeSelect.Field {...register('status')}>
                        <option value="observed">Observed</option>
                        <option value="lost">Lost</option>
                        <option value="planned">Not recorded (planned)</option>
                      </NativeSelect.Field>
                      <NativeSelect.Indicator />
                    </NativeSelect.Root>
                  </FormField>
                  {status === 'observed' && (
                    <>
                      <FormField label="Hours obtained" error={errors.hoursObtained} required>
                        <Input
                          inputMode="decimal"
                          {...register('hoursObtained', {
                            validate: (v) =>
                              (v.trim() !== '' &&
                                Number(v) >= 0 &&
                                Number(v) <= (run?.hours ?? 24) + 1e-9) ||
                              `From 0 to the run's ${run ? hoursText(run.hours) : ''}`,
                          })}
                        />
                      </FormField>
                      <FormField label="Quality note" error={errors.qualityNote}>
                        <Textarea rows={3} {...register('qualityNote', { maxLength: 5000 })} />
                      </FormField>
                    </>
                  )}
                  {status === 'lost' && (
                    <FormField label="Lost to" error={errors.lostReason} required>
                      <NativeSelect.Root>
                        <NativeSelect.Field {...register('lostReason')}>
                          <option value="weather">Weather</option>
                          <option value="fault">Fault</option>
                        </NativeSelect.Field>
                        <NativeSelect.Indicator />
                      </NativeSelect.Root>
                    </FormField>
                  )}
                  <FormError error={errors.root?.server} />
                </Stack>
              </Dialog.Body>
              <Dialog.Footer>
                <Dialog.ActionTrigger asChild>
                  <Button variant="outline">Cancel</Button>
                </Dialog.ActionTrigger>
                <Button type="submit" loading={update.isPending}>
                  Save record
                </Button>
              </Dialog.Footer>
              <Dialog.CloseTrigger asChild>
                <CloseButton size="sm" aria-label="Close" />
              </Dialog.CloseTrigger>
            </form>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
