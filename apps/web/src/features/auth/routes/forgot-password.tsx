import { Button, Input, Link, Stack } from '@chakra-ui/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link as RouterLink } from 'react-router-dom';
import { FormError, FormField } from '@/components/ui/form-field';
import { setServerErrors } from '@/lib/form-errors';
import { defineRoute } from '@/lib/route-module';
import { AuthPanel } from '../components/auth-panel';
import { DoneMessage } from '../components/done-message';
import { useRequestPasswordReset } from '../hooks';
import { authPaths } from '../paths';

function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const [answer, setAnswer] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<{ email: string }>({ defaultValues: { email: '' } });

  const onSubmit = handleSubmit(({ email }) =>
    request.mutate(email, {
      onSuccess: ({ message }) => setAnswer(message),
      onError: (error) => setServerErrors(error, setError, ['email']),
    }),
  );

  return (
    <AuthPanel
      title="Choose a new password"
      description="We send a link to your e-mail address; it works once, for an hour."
    >
      {answer ? (
        <DoneMessage title="Check your inbox">{answer}</DoneMessage>
      ) : (
        <form onSubmit={onSubmit} noValidate>
          <Stack gap="4">
            <FormField label="E-mail" error={errors.email} required>
              <Input
                type="email"
                autoComplete="email"
                {...register('email', { required: 'Enter your e-mail address' })}
              />
            </FormField>
            <FormError error={errors.root?.server} />
            <Button type="submit" loading={request.isPending}>
              Send the link
            </Button>
          </Stack>
        </form>
      )}
      <Link asChild fontSize="sm">
        <RouterLink to={authPaths.signIn}>Back to sign in</RouterLink>
      </Link>
    </AuthPanel>
  );
}

export const route = defineRoute({ Component: ForgotPasswordPage });
