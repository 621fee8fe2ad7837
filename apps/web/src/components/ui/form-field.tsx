import { Alert, Field } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import type { FieldError } from 'react-hook-form';

export interface FormFieldProps extends Omit<Field.RootProps, 'children'> {
  label: ReactNode;
  /** react-hook-form's error for this field (`formState.errors.x`), or a message. */
  error?: FieldError | string;
  helperText?: ReactNode;
  /** The control: Chakra's `Input`, `Textarea`, `NativeSelect` … taking `register('x')`. */
  children: ReactNode;
}

/**
 * One labelled form control with its help and error text. Field.Root wires the label's `for`,
 * the control's `aria-invalid` and `aria-describedby`, so a screen reader reads the error with
 * the field.
 */
export function FormField({
  label,
  error,
  helperText,
  required,
  children,
  ...rest
}: FormFieldProps) {
  const message = typeof error === 'string' ? error : error?.message;
  return (
    <Field.Root invalid={Boolean(message)} required={required} {...rest}>
      <Field.Label>
        {label}
        <Field.RequiredIndicator />
      </Field.Label>
      {children}
      {helperText && <Field.HelperText>{helperText}</Field.HelperText>}
      {message && <Field.ErrorText>{message}</Field.ErrorText>}
    </Field.Root>
  );
}

/** The form's own error (`errors.root.server`), shown above the submit button. */
export function FormError({ error }: { error?: { message?: string } }) {
  if (!error?.message) return null;
  return (
    <Alert.Root status="error" colorPalette="blocker" role="alert">
      <Alert.Indicator />
      <Alert.Title>{error.message}</Alert.Title>
    </Alert.Root>
  );
}
