import { Button, Input, Stack } from '@chakra-ui/react';
import { useForm } from 'react-hook-form';
import { CountrySelect } from '@/components/ui/country-select';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import type { Profile } from '../api';
import { useUpdateProfile } from '../hooks';

interface DetailsValues {
  name: string;
  affiliation: string;
  country: string;
  orcid: string;
}

const FIELDS = ['name', 'affiliation', 'country', 'orcid'] as const;

/** Name, institute, country and ORCID iD. The e-mail address is shown but not changed here. */
export function DetailsForm({ profile }: { profile: Profile }) {
  const update = useUpdateProfile();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useForm<DetailsValues>({
    values: {
      name: profile.name,
      affiliation: profile.affiliation,
      country: profile.country,
      orcid: profile.orcid ?? '',
    },
  });

  const onSubmit = handleSubmit(({ orcid, ...values }) =>
    update.mutate(
      { ...values, orcid: orcid.trim() || null },
      {
        onSuccess: (saved) => {
          reset({ ...values, orcid: saved.orcid ?? '' });
          toaster.create({ type: 'success', title: 'Your details are saved' });
        },
        onError: (error) => setServerErrors(error, setError, FIELDS),
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Your details">
      <Stack gap="4">
        <FormField label="E-mail" helperText="Used to sign in; it cannot be changed here.">
          <Input value={profile.email} readOnly />
        </FormField>
        <FormField label="Name" error={errors.name} required>
          <Input autoComplete="name" {...register('name', { required: 'Enter your name' })} />
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
        <FormField label="ORCID iD" error={errors.orcid} helperText="Optional">
          <Input spellCheck={false} {...register('orcid')} />
        </FormField>
        <FormError error={errors.root?.server} />
        <Button type="submit" alignSelf="start" loading={update.isPending} disabled={!isDirty}>
          Save the details
        </Button>
      </Stack>
    </form>
  );
}
