import { Button, Input, Link, Stack, Text } from '@chakra-ui/react';
import { useForm } from 'react-hook-form';
import { Link as RouterLink, redirect, useNavigate, useSearchParams } from 'react-router-dom';
import { FormError, FormField } from '@/components/ui/form-field';
import { sessionQueryOptions } from '@/features/session/api';
import { setServerErrors } from '@/lib/form-errors';
import { defineRoute } from '@/lib/route-module';
import type { Credentials } from '../api';
import { AuthPanel } from '../components/auth-panel';
import { useSignIn } from '../hooks';
import { authPaths, safeNext } from '../paths';

function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const navigate = useNavigate();
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<Credentials>({ defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: () => void navigate(next, { replace: true }),
      onError: (error) => setServerErrors(error, setError, ['email', 'password']),
    }),
  );

  return (
    <AuthPanel
      title="Sign in"
      description={params.has('next') ? 'Please sign in to go on to that page.' : undefined}
    >
      <form onSubmit={onSubmit} noValidate>
        <Stack gap="4">
          <FormField label="E-mail" error={errors.email} required>
            <Input
              type="email"
              autoComplete="username"
              {...register('email', { required: 'Enter your e-mail address' })}
            />
          </FormField>
          <FormField label="Password" error={errors.password} required>
            <Input
              type="password"
              autoComplete="current-password"
              {...register('password', { required: 'Enter your password' })}
            />
          </FormField>
          <FormError error={errors.root?.server} />
          <Button type="submit" loading={signIn.isPending}>
            Sign in
          </Button>
        </Stack>
      </form>
      <Stack gap="1" fontSize="sm">
        <Link asChild>
          <RouterLink to={authPaths.forgotPassword}>Forgotten your password?</RouterLink>
        </Link>
        <Text>
          New to Skyhours?{' '}
          <Link asChild>
            <RouterLink to={authPaths.register}>Make an account</RouterLink>
          </Link>
        </Text>
      </Stack>
    </AuthPanel>
  );
}

export const route = defineRoute({
  Component: SignInPage,
  // Someone already signed in goes straight on.
  loader:
    (queryClient) =>
    async ({ request }) => {
      const session = await queryClient.ensureQueryData(sessionQueryOptions());
      if (session) return redirect(safeNext(new URL(request.url).searchParams.get('next')));
      return null;
    },
});
