import { Button, Input, Link, Stack, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link as RouterLink } from 'react-router-dom';
import { CountrySelect } from '@/components/ui/country-select';
import { FormError, FormField } from '@/components/ui/form-field';
import { setServerErrors } from '@/lib/form-errors';
import { defineRoute } from '@/lib/route-module';
import type { Registration } from '../api';
import { AuthPanel } from '../components/auth-panel';
import { DoneMessage } from '../components/done-message';
import { useRegister } from '../hooks';
import { authPaths } from '../paths';

interface RegisterForm extends Required<Registration> {
  repeatPassword: string;
}

const FIELDS = ['name', 'email', 'affiliation', 'country', 'orcid', 'password'] as const;

function RegisterPage() {
  const registration = useRegister();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    getValues,
    formState: { errors },
  } = useForm<RegisterForm>({
    defaultValues: {
      name: '',
      email: '',
      affiliation: '',
      country: '',
      orcid: '',
      password: '',
      repeatPassword: '',
    },
  });

  const onSubmit = handleSubmit(({ repeatPassword: _repeat, orcid, ...values }) =>
    registration.mutate(
      { ...values, ...(orcid.trim() ? { orcid: orcid.trim() } : {}) },
      {
        onSuccess: () => setSentTo(values.email),
        onError: (error) => setServerErrors(error, setError, FIELDS),
      },
    ),
  );

  if (sentTo) {
    return (
      <AuthPanel title="Make an account">
        <DoneMessage title="Check your inbox">
          We have sent a message to {sentTo}. Open the link in it to confirm the address; then you
          can submit proposals and write reviews.
        </DoneMessage>
        <Link asChild fontSize="sm">
          <RouterLink to={authPaths.signIn}>Go to sign in</RouterLink>
        </Link>
      </AuthPanel>
    );
  }

  return (
    <AuthPanel
      title="Make an account"
      description="One account for proposing, reviewing and everything else you do here."
    >
      <form onSubmit={onSubmit} noValidate>
        <Stack gap="4">
          <FormField label="Name" error={errors.name} required>
            <Input autoComplete="name" {...register('name', { required: 'Enter your name' })} />
          </FormField>
          <FormField label="E-mail" error={errors.email} required>
            <Input
              type="email"
              autoComplete="email"
              {...register('email', { required: 'Enter your e-mail address' })}
            />
          </FormField>
          <FormField label="Institute" error={errors.affiliation} required>
            <Input
              autoComplete="organization"
              {...register('affiliation', { required: 'Enter your institute' })}
            />
          </FormField>
          <FormField label="Institute's country" error={errors.country} required>
            <CountrySelect {...register('country', { required: 'Choose the country' })} />
          </FormField>
          <FormField
            label="ORCID iD"
            error={errors.orcid}
            helperText="Optional, e.g. 0000-0002-1825-0097"
          >
            <Input inputMode="text" spellCheck={false} {...register('orcid')} />
          </FormField>
          <FormField
            label="Password"
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
          <FormField label="Repeat the password" error={errors.repeatPassword} required>
            <Input
              type="password"
              autoComplete="new-password"
              {...register('repeatPassword', {
                validate: (value) => value === getValues('password') || 'The passwords differ',
              })}
            />
          </FormField>
          <FormError error={errors.root?.server} />
          <Button type="submit" loading={registration.isPending}>
            Make the account
          </Button>
        </Stack>
      </form>
      <Text fontSize="sm">
        Already have an account?{' '}
        <Link asChild>
          <RouterLink to={authPaths.signIn}>Sign in</RouterLink>
        </Link>
      </Text>
    </AuthPanel>
  );
}

export const route = defineRoute({ Component: RegisterPage });
