import { Button, Input, Stack } from '@chakra-ui/react';
import { useForm } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../hooks';

interface PasswordValues {
  currentPassword: string;
  newPassword: string;
  repeatPassword: string;
}

const EMPTY: PasswordValues = { currentPassword: '', newPassword: '', repeatPassword: '' };

/** A new password; this session stays signed in and every other one of the account ends. */
export function PasswordForm() {
  const change = useChangePassword();
  const {
    register,
    handleSubmit,
    setError,
    getValues,
    reset,
    formState: { errors },
  } = useForm<PasswordValues>({ defaultValues: EMPTY });

  const onSubmit = handleSubmit(({ currentPassword, newPassword }) =>
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: () => {
          reset(EMPTY);
          toaster.create({
            type: 'success',
            title: 'Your password is changed',
            description: 'Your other sessions have been signed out.',
          });
        },
        onError: (error) => setServerErrors(error, setError, ['currentPassword', 'newPassword']),
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Change the password">
      <Stack gap="4">
        <FormField label="Current password" error={errors.currentPassword} required>
          <Input
            type="password"
            autoComplete="current-password"
            {...register('currentPassword', { required: 'Enter your current password' })}
          />
        </FormField>
        <FormField
          label="New password"
          error={errors.newPassword}
          helperText="At least 12 characters; a few unrelated words make a good one."
          required
        >
          <Input
            type="password"
            autoComplete="new-password"
            {...register('newPassword', {
              required: 'Choose a new password',
              minLength: { value: 12, message: 'Use at least 12 characters' },
            })}
          />
        </FormField>
        <FormField label="Repeat the new password" error={errors.repeatPassword} required>
          <Input
            type="password"
            autoComplete="new-password"
            {...register('repeatPassword', {
              validate: (value) => value === getValues('newPassword') || 'The passwords differ',
            })}
          />
        </FormField>
        <FormError error={errors.root?.server} />
        <Button type="submit" alignSelf="start" loading={change.isPending}>
          Change the password
        </Button>
      </Stack>
    </form>
  );
}
