import { Button, Input, Link, Stack, Text } from '@chakra-ui/react';
import { useForm } from 'react-hook-form';
import { Link as RouterLink, useSearchParams } from 'react-router-dom';
import { FormError, FormField } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { FORM_ERROR, setServerErrors } from '@/lib/form-errors';
import { defineRoute } from '@/lib/route-module';
import { AuthPanel } from '../components/auth-panel';
import { DoneMessage } from '../components/done-message';
import { useConfirmPasswordReset } from '../hooks';
import { authPaths } from '../paths';

interface ResetForm {
  password: string;
  repeatPassword: string;
}

function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const confirm = useConfirmPasswordReset();
  const {
    register,
    handleSubmit,
    setError,
    getValues,
    formState: { errors },
  } = useForm<ResetForm>({ defaultValues: { password: '', repeatPassword: '' } });

  const onSubmit = handleSubmit(({ password }) =>
    confirm.mutate(
      { token, password },
      {
        onError: (error) => {
          // A used or expired link is an issue on `token`, which has no field here.
          const tokenIssue = isApiError(error) && error.issues.find((i) => i.path === 'token');
          if (tokenIssue) {
            setError(FORM_ERROR, {
              type: 'server',
              message: `${tokenIssue.message}. Ask for a new link below.`,
            });
          } else setServerErrors(error, setError, ['password']);
        },
      },
    ),
  );

  if (confirm.isSuccess) {
    return (
      <AuthPanel title="Choose a new password">
        <DoneMessage title="Your new password is set">
          Every session of your account has been signed out. Sign in with the new password.
        </DoneMessage>
        <Button asChild>
          <RouterLink to={authPaths.signIn}>Sign in</RouterLink>
        </Button>
      </AuthPanel>
    );
  }

  return (
    <AuthPanel title="Choose a new password">
      {!token ? (
        <Text>This link is incomplete. Open the link from the e-mail again, whole.</Text>
      ) : (
        <form onSubmit={onSubmit} noValidate>
          <Stack gap="4">
            <FormField
              label="New password"
              error={errors.password}
              helperText="At least 12 characters; a few unrelated words make a good one."
              required
            >
              <Input
                type="password"
                autoComplete="new-password"
                {...register('password', {
                  required: 'Choose a password',
                  minLength: { value: 12, message: 'Use at least 12 characters' },
                })}
              />
            </FormField>
            <FormField label="Repeat the new password" error={errors.repeatPassword} required>
              <Input
                type="password"
                autoComplete="new-password"
                {...register('repeatPassword', {
                  validate: (value) => value === getValues('password') || 'The passwords differ',
                })}
              />
            </FormField>
            <FormError error={errors.root?.server} />
            <Button type="submit" loading={confirm.isPending}>
              Set the password
            </Button>
          </Stack>
        </form>
      )}
      <Link asChild fontSize="sm">
        <RouterLink to={authPaths.forgotPassword}>Ask for a new link</RouterLink>
      </Link>
    </AuthPanel>
  );
}

export const route = defineRoute({ Component: ResetPasswordPage });
