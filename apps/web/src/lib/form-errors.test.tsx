import { Button, Input } from '@chakra-ui/react';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useForm } from 'react-hook-form';
import { describe, expect, it } from 'vitest';
import { FormError, FormField } from '@/components/ui/form-field';
import { renderWithProviders } from '@/testing/render';
import { ApiError } from './api-client';
import { setServerErrors } from './form-errors';

interface TargetForm {
  name: string;
  fluxMJy: string;
}

/** A form as a feature would write it, failing with whatever `failure` the server gave. */
function TargetFormUnderTest({
  failure,
  fields,
}: {
  failure: unknown;
  fields?: readonly (keyof TargetForm)[];
}) {
  const { register, handleSubmit, setError, formState } = useForm<TargetForm>({
    defaultValues: { name: 'Quiet group 7', fluxMJy: '3' },
  });
  const onSubmit = handleSubmit(() => setServerErrors(failure, setError, fields));
  return (
    <form onSubmit={onSubmit} noValidate>
      <FormField label="Target name" error={formState.errors.name} required>
        <Input {...register('name')} />
      </FormField>
      <FormField
        label="Flux density (mJy)"
        error={formState.errors.fluxMJy}
        helperText="At the sky frequency."
      >
        <Input {...register('fluxMJy')} />
      </FormField>
      <FormError error={formState.errors.root?.server} />
      <Button type="submit">Save</Button>
    </form>
  );
}

describe('server issues on a form', () => {
  it('puts each issue under its field, marks it invalid and focuses the first', async () => {
    const failure = new ApiError(422, 'VALIDATION_FAILED', 'Check the target.', {
      issues: [
        { path: 'fluxMJy', message: 'Flux density must be positive.' },
        { path: 'name', message: 'A target of this name exists.' },
      ],
    });
    renderWithProviders(<TargetFormUnderTest failure={failure} />);

    await userEvent.click(screen.getByRole('button', { name: 'Save' }));

    const flux = await screen.findByRole('textbox', { name: 'Flux density (mJy)' });
    expect(flux).toHaveAttribute('aria-invalid', 'true');
    expect(flux).toHaveAccessibleDescription(
      expect.stringContaining('Flux density must be positive.'),
    );
    expect(flux).toHaveFocus();
    expect(screen.getByRole('textbox', { name: /Target name/ })).toHaveAccessibleDescription(
      'A target of this name exists.',
    );
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('shows an error without issues as the form’s own error', async () => {
    renderWithProviders(
      <TargetFormUnderTest
        failure={new ApiError(409, 'CALL_CLOSED', 'The call closed at 12:00 UTC.')}
      />,
    );

    await userEvent.click(screen.getByRole('button', { name: 'Save' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('The call closed at 12:00 UTC.');
    expect(screen.getByRole('textbox', { name: /Target name/ })).not.toHaveAttribute(
      'aria-invalid',
    );
  });

  it('keeps issues about fields the form does not have, naming their path', async () => {
    const failure = new ApiError(422, 'VALIDATION_FAILED', 'Check the target.', {
      issues: [
        { path: 'name', message: 'Too long.' },
        { path: 'lines[0].restGHz', message: 'Rest frequency is missing.' },
      ],
    });
    renderWithProviders(<TargetFormUnderTest failure={failure} fields={['name', 'fluxMJy']} />);

    await userEvent.click(screen.getByRole('button', { name: 'Save' }));

    expect(await screen.findByRole('alert')).toHaveTextContent(
      'lines.0.restGHz: Rest frequency is missing.',
    );
    expect(screen.getByRole('textbox', { name: /Target name/ })).toHaveAccessibleDescription(
      'Too long.',
    );
  });

  it('reports a failure that is not from the API on the form', async () => {
    renderWithProviders(<TargetFormUnderTest failure={new Error('Offline.')} />);

    await userEvent.click(screen.getByRole('button', { name: 'Save' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Offline.');
  });
});
